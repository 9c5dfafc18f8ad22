import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gte, inArray, lte, min } from 'drizzle-orm';
import { buildLedger, type Ledger, type LedgerPunch, type PunchDto } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { punches } from '../db/schema/index.js';
import { ShopService } from '../shop/shop.service.js';

type PunchRow = typeof punches.$inferSelect;

/** How far back a punch can matter to "now": the longest shift we expect to still be open. */
const OPEN_SHIFT_LOOKBACK_MS = 36 * 3600_000;

export function toPunchDto(row: PunchRow): PunchDto {
  return {
    id: row.id,
    technicianId: row.technicianId,
    kind: row.kind,
    jobLineId: row.jobLineId,
    breakKind: row.breakKind,
    at: row.at.toISOString(),
    recordedAt: row.recordedAt.toISOString(),
    recordedBy: row.recordedBy,
    supersedes: row.supersedes,
    reason: row.reason,
    voids: row.voids,
  };
}

export interface LineSeconds {
  total: number;
  byTechnician: Map<number, number>;
}

/** Reads punches and turns them into ledgers with the shop's rules; writes nothing. */
@Injectable()
export class LabourService {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
  ) {}

  punchesOf(technicianId: number, from: Date, to: Date): LedgerPunch[] {
    return this.db
      .select()
      .from(punches)
      .where(and(eq(punches.technicianId, technicianId), gte(punches.at, from), lte(punches.at, to)))
      .orderBy(asc(punches.at))
      .all()
      .map(toPunchDto);
  }

  ledgerOf(technicianId: number, from: Date, now: Date): Ledger {
    return buildLedger(this.punchesOf(technicianId, from, now), now, this.shop.settings(now));
  }

  /** Clocked seconds on each line up to `now`, per technician and in all, with the split rule. */
  lineSeconds(jobLineIds: number[], now: Date): Map<number, LineSeconds> {
    if (jobLineIds.length === 0) return new Map();
    const starts = this.db
      .select({ technicianId: punches.technicianId, first: min(punches.at) })
      .from(punches)
      .where(inArray(punches.jobLineId, jobLineIds))
      .groupBy(punches.technicianId)
      .all();
    const ledgers = new Map(
      starts.flatMap(({ technicianId, first }) =>
        first
          ? [
              [
                technicianId,
                this.ledgerOf(technicianId, new Date(first.getTime() - OPEN_SHIFT_LOOKBACK_MS), now),
              ] as const,
            ]
          : [],
      ),
    );
    return lineSecondsOf(ledgers, jobLineIds);
  }
}

/** Sums the ledgers' seconds on each of the lines, per technician and in all. */
function lineSecondsOf(ledgers: ReadonlyMap<number, Ledger>, jobLineIds: number[]): Map<number, LineSeconds> {
  const result = new Map<number, LineSeconds>(
    jobLineIds.map((id) => [id, { total: 0, byTechnician: new Map() }]),
  );
  for (const [technicianId, ledger] of ledgers)
    for (const [lineId, seconds] of Object.entries(ledger.totals.jobSeconds)) {
      const line = result.get(Number(lineId));
      if (!line || seconds === 0) continue;
      line.total += seconds;
      line.byTechnician.set(technicianId, (line.byTechnician.get(technicianId) ?? 0) + seconds);
    }
  return result;
}
