import type { PartsHoldDto } from '@baytime/shared';
import type { partsHolds } from '../db/schema/index.js';
import type { FloorLine } from '../floor/floor.service.js';

type PartsRow = Pick<
  typeof partsHolds.$inferSelect,
  'part' | 'state' | 'supplier' | 'expectedAt' | 'receivedAt'
>;

export function toPartsHoldDto(row: PartsRow): PartsHoldDto {
  return {
    part: row.part,
    state: row.state,
    supplier: row.supplier,
    expectedAt: row.expectedAt?.toISOString() ?? null,
    receivedAt: row.receivedAt?.toISOString() ?? null,
  };
}

type LineWithParts = Pick<FloorLine, 'status' | 'holdReason' | 'parts'>;

/** What a line waits for now: its open parts hold while it is held for parts. */
export function waitingParts(line: LineWithParts): PartsHoldDto | null {
  return line.status === 'held' && line.holdReason === 'parts' && line.parts && !line.parts.receivedAt
    ? line.parts
    : null;
}

export const waitingPartsOf = (line: LineWithParts | undefined) => (line ? waitingParts(line) : null);

/** Parts received for a line that has not been started again since: its technician hears of it. */
export function receivedParts(line: LineWithParts): PartsHoldDto | null {
  return line.status === 'queued' && line.parts?.receivedAt ? line.parts : null;
}
