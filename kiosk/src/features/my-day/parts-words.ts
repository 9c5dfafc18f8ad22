import type { MyJobLine } from '@baytime/shared';
import { clockTime } from '@/lib/format';

/** Under a line held for parts: "Waiting for tie rod end · due 2:30 pm", or "· late" once past. */
export function partsWaitText(line: MyJobLine, nowMs: number, timeZone: string | undefined): string | null {
  const parts = line.parts;
  if (line.status !== 'held' || line.holdReason !== 'parts' || !parts || parts.receivedAt) return null;
  const what = parts.part ? `Waiting for ${parts.part}` : 'Waiting for parts';
  if (!parts.expectedAt) return what;
  if (Date.parse(parts.expectedAt) <= nowMs) return `${what} · late`;
  return `${what} · due ${clockTime(parts.expectedAt, timeZone)}`;
}

/** The lines whose parts came in since they were held: back in the technician's queue. */
export function partsInNotices(lines: readonly MyJobLine[]): string[] {
  return lines
    .filter((line) => line.status === 'queued' && line.parts?.receivedAt)
    .map(
      (line) =>
        `Parts are in for RO ${line.repairOrderNumber} line ${line.lineNo}${line.parts?.part ? ` (${line.parts.part})` : ''}: it is back in your queue.`,
    );
}
