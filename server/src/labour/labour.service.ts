import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gte, lte, sql } from 'drizzle-orm';
import {
  buildLedger,
  type BreakKind,
  type Ledger,
  type LedgerPunch,
  type PunchDto,
  type PunchKind,
} from '@baytime/shared';
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

/** The columns a ledger reads. */
export const LEDGER_PUNCH_COLUMNS = {
  id: punches.id,
  technicianId: punches.technicianId,
  kind: punches.kind,
  jobLineId: punches.jobLineId,
  breakKind: punches.breakKind,
  at: punches.at,
  supersedes: punches.supersedes,
  voids: punches.voids,
};

/** A punch as a raw row of `LEDGER_PUNCH_COLUMNS`: `at` in ms, `voids` 0 or 1. */
export type LedgerPunchValues = [
  id: string,
  technicianId: number,
  kind: PunchKind,
  jobLineId: number | null,
  breakKind: BreakKind | null,
  at: number,
  supersedes: string | null,
  voids: number,
];

export function toLedgerPunch([
  id,
  technicianId,
  kind,
  jobLineId,
  breakKind,
  at,
  supersedes,
  voids,
]: LedgerPunchValues): LedgerPunch {
  return {
    id,
    technicianId,
    kind,
    jobLineId,
    breakKind,
    at: new Date(at).toISOString(),
    supersedes,
    voids: voids === 1,
  };
}

/**
 * The punches that count for the lines `:lines` (a JSON array of ids) up to `:now`: each technician's
 * shifts around their punches on those lines, not their whole history. A job on a line runs from a punch
 * on it to a punch no later than the shift-out that follows; the other jobs it shares its time with
 * opened after the shift-out before. So per technician and UTC day of punches on the lines, the punches
 * from the last shift-out before the first of them (at most `:lookback` back, as far as a shift may
 * still be open) to the first shift-out at or after the last (or `:now`), and every correction of those
 * punches, wherever it falls. As long as no shift stays open longer than the lookback, their ledger gives
 * each line the seconds that a ledger of all the technician's punches gives it. The windows are read by
 * rowid from the (technician, at) index alone, and the rows come back raw: both cost less than the
 * rows themselves.
 */
function punchesAroundLines(db: Db) {
  return db
    .select(LEDGER_PUNCH_COLUMNS)
    .from(punches)
    .where(
      sql`${punches}.rowid in (
        with recursive
          on_lines as (
            select technician_id, min(at) as first, max(at) as last from punches
            where job_line_id in (select value from json_each(${sql.placeholder('lines')}))
            group by technician_id, cast(at / 86400000 as integer)
          ),
          windows as (
            select technician_id,
              coalesce((
                select at from punches shift_out
                where shift_out.technician_id = on_lines.technician_id and shift_out.kind = 'shift-out'
                  and shift_out.at < on_lines.first and shift_out.at >= on_lines.first - ${sql.placeholder('lookback')}
                order by shift_out.at desc limit 1
              ), on_lines.first - ${sql.placeholder('lookback')}) as start,
              coalesce((
                select at from punches shift_out
                where shift_out.technician_id = on_lines.technician_id and shift_out.kind = 'shift-out'
                  and shift_out.at >= on_lines.last and shift_out.at <= ${sql.placeholder('now')}
                order by shift_out.at limit 1
              ), ${sql.placeholder('now')}) as end
            from on_lines
          ),
          counted(row) as (
            select punch.rowid from windows
              join punches punch on punch.technician_id = windows.technician_id
                and punch.at >= windows.start and punch.at <= windows.end
            union
            select correction.rowid from counted
              join punches corrected on corrected.rowid = counted.row
              join punches correction on correction.supersedes = corrected.id
            where correction.at <= ${sql.placeholder('now')}
          )
        select row from counted
      )`,
    )
    .orderBy(asc(punches.technicianId), asc(punches.at))
    .prepare();
}

/** Reads punches and turns them into ledgers with the shop's rules; writes nothing. */
@Injectable()
export class LabourService {
  private readonly aroundLines: ReturnType<typeof punchesAroundLines>;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
  ) {
    this.aroundLines = punchesAroundLines(db);
  }

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
    const rows = this.aroundLines.values({
      lines: JSON.stringify(jobLineIds),
      now: now.getTime(),
      lookback: OPEN_SHIFT_LOOKBACK_MS,
    }) as LedgerPunchValues[];
    const byTechnician = new Map<number, LedgerPunch[]>();
    for (const row of rows) {
      const punched = byTechnician.get(row[1]) ?? [];
      if (punched.length === 0) byTechnician.set(row[1], punched);
      punched.push(toLedgerPunch(row));
    }
    const settings = this.shop.settings(now);
    const ledgers = new Map(
      [...byTechnician].map(([technicianId, punched]) => [technicianId, buildLedger(punched, now, settings)]),
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
