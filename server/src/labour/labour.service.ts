import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gte, lte, sql, type SQL } from 'drizzle-orm';
import {
  buildLedger,
  type BreakKind,
  type Ledger,
  type LedgerPunch,
  type PunchDto,
  type PunchKind,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { inTransaction } from '../db/in-transaction.js';
import { punches } from '../db/schema/index.js';
import { counts, prepareReadFrom } from '../punches/last-shift-out.js';
import { ShopService } from '../shop/shop.service.js';
import { KeptLineSeconds, type LineSeconds, type PunchWindow } from './kept-line-seconds.js';

type PunchRow = typeof punches.$inferSelect;

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

export type { LineSeconds } from './kept-line-seconds.js';

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

/** A window of punches, with the requested lines punched on in it; `end` null while no shift-out closed it. */
interface LineWindow {
  technicianId: number;
  lines: string;
  start: number;
  end: number | null;
}

/**
 * The punches that count for the lines `lines` up to `now`: each technician's shifts around their punches
 * on those lines, not their whole history. A job on a line runs from a punch on it to a punch no later
 * than the shift-out that follows; the other jobs it shares its time with opened after the shift-out
 * before. So per technician and UTC day of punches on the lines, a window from the last shift-out before
 * the first of them (however long ago: a shift left open over a weekend still opened the job) to the
 * first shift-out at or after the last (none yet: the window runs to `now`); a corrected shift-out ends
 * nothing. A ledger of the punches in the windows gives each line the seconds that a ledger of all the
 * technician's punches gives it. The last shift-out is found walking back the (technician, at) index.
 */
function windowsAroundLines(db: Db, lines: readonly number[], now: number): LineWindow[] {
  const shiftOut = (at: SQL) => sql`
    select at from punches shift_out
    where shift_out.technician_id = on_lines.technician_id and shift_out.kind = 'shift-out' and ${at}
      and ${counts('shift_out')}`;
  return db.all<LineWindow>(sql`
    with on_lines as (
      select technician_id, min(at) as first, max(at) as last, json_group_array(distinct job_line_id) as lines
      from punches where job_line_id in (select value from json_each(${JSON.stringify(lines)}))
      group by technician_id, cast(at / 86400000 as integer)
    )
    select technician_id as technicianId, lines,
      coalesce((
        ${shiftOut(sql`shift_out.at < on_lines.first`)}
        order by shift_out.at desc limit 1
      ), 0) as start,
      (
        ${shiftOut(sql`shift_out.at >= on_lines.last and shift_out.at <= ${now}`)}
        order by shift_out.at limit 1
      ) as end
    from on_lines`);
}

/**
 * The punches in the windows (`end` up to `now`) and every correction of them, wherever it falls, as raw
 * rows. They are read by rowid from the (technician, at) index alone: that costs less than the rows.
 */
function punchesIn(db: Db, windows: readonly PunchWindow[], now: number): LedgerPunchValues[] {
  const given = JSON.stringify(windows.map(({ technicianId, start, end }) => [technicianId, start, end]));
  return db
    .select(LEDGER_PUNCH_COLUMNS)
    .from(punches)
    .where(
      sql`${punches}.rowid in (
        with recursive
          windows(technician_id, start, end) as (
            select value ->> 0, value ->> 1, value ->> 2 from json_each(${given})
          ),
          counted(row) as (
            select punch.rowid from windows
              join punches punch on punch.technician_id = windows.technician_id
                and punch.at >= windows.start and punch.at <= windows.end
            union
            select correction.rowid from counted
              join punches corrected on corrected.rowid = counted.row
              join punches correction on correction.supersedes = corrected.id
            where correction.at <= ${now}
          )
        select row from counted
      )`,
    )
    .values() as LedgerPunchValues[];
}

/** Reads punches and turns them into ledgers with the shop's rules; writes nothing. */
@Injectable()
export class LabourService {
  private readonly kept: KeptLineSeconds;
  private readonly readFrom: ReturnType<typeof prepareReadFrom>;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
  ) {
    this.kept = new KeptLineSeconds(db);
    this.readFrom = prepareReadFrom(db);
  }

  private punchesOf(technicianId: number, from: Date, to: Date): LedgerPunch[] {
    return this.db
      .select()
      .from(punches)
      .where(and(eq(punches.technicianId, technicianId), gte(punches.at, from), lte(punches.at, to)))
      .orderBy(asc(punches.at))
      .all()
      .map(toPunchDto);
  }

  /** The technician's ledger up to `now`, read back far enough to hold a shift that was open at `from`. */
  ledgerSince(technicianId: number, from: Date, now: Date): Ledger {
    const start = new Date(this.readFrom(technicianId, from.getTime()));
    return buildLedger(this.punchesOf(technicianId, start, now), now, this.shop.ledgerSettings(now));
  }

  /**
   * Clocked seconds on each line up to `now`, per technician and in all, with the split rule. A line whose
   * windows all ended with a shift-out is kept (`KeptLineSeconds`) and counted again only after a punch
   * reaches into one of them.
   */
  lineSeconds(jobLineIds: number[], now: Date): Map<number, LineSeconds> {
    if (jobLineIds.length === 0) return new Map();
    const settings = this.shop.ledgerSettings(now);
    // Inside a transaction the rows may yet be rolled back: nothing kept is read or kept.
    const keeping = !inTransaction(this.db);
    if (keeping) this.kept.refresh(settings, now);
    const result = new Map<number, LineSeconds>();
    const missing: number[] = [];
    for (const id of jobLineIds) {
      const kept = keeping ? this.kept.get(id, now) : undefined;
      if (kept) result.set(id, kept);
      else missing.push(id);
    }
    if (missing.length === 0) return result;

    const windows = windowsAroundLines(this.db, missing, now.getTime());
    const rows = punchesIn(
      this.db,
      windows.map((w) => ({ ...w, end: w.end ?? now.getTime() })),
      now.getTime(),
    );
    const byTechnician = new Map<number, LedgerPunch[]>();
    for (const row of rows) {
      const punched = byTechnician.get(row[1]) ?? [];
      if (punched.length === 0) byTechnician.set(row[1], punched);
      punched.push(toLedgerPunch(row));
    }
    const ledgers = new Map(
      [...byTechnician].map(([technicianId, punched]) => [technicianId, buildLedger(punched, now, settings)]),
    );
    const windowsOf = new Map<number, LineWindow[]>();
    for (const window of windows)
      for (const id of JSON.parse(window.lines) as number[]) {
        const own = windowsOf.get(id);
        if (own) own.push(window);
        else windowsOf.set(id, [window]);
      }
    for (const [id, seconds] of lineSecondsOf(ledgers, missing)) {
      result.set(id, seconds);
      const own = windowsOf.get(id) ?? [];
      if (keeping && own.every((window) => window.end !== null))
        this.kept.keep(
          id,
          seconds,
          own.map(({ technicianId, start, end }) => ({ technicianId, start, end: end! })),
          now,
        );
    }
    return result;
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
