import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gte, inArray, lt, min, or, isNull, ne } from 'drizzle-orm';
import {
  buildLedger,
  shareFlaggedHours,
  workweekBounds,
  workweekDays,
  type BreakKind,
  type LabourHours,
  type Ledger,
  type LedgerPunch,
  type LedgerTotals,
  type PunchKind,
  type ShopDay,
  type ShopSettings,
  type TimeRange,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { jobLines, punches } from '../db/schema/index.js';

/** A shift still open at the start of a week began before it: look back this far for it (as timecards do). */
export const LOOKBACK_MS = 36 * 3600_000;
/** Bound on the ids in one `IN (…)` list (SQLite allows 32,766 parameters). */
const IN_CHUNK = 5000;
export const HOUR_S = 3600;

type PunchValues = [
  id: string,
  technicianId: number,
  kind: PunchKind,
  jobLineId: number | null,
  breakKind: BreakKind | null,
  at: number,
  supersedes: string | null,
  voids: boolean,
];

interface TechnicianPunches {
  ms: number[];
  list: LedgerPunch[];
}

export interface TechnicianWeek {
  ledger: Ledger;
  /** The ledger clipped to the workweek. */
  totals: LedgerTotals;
}

/** One workweek's raw figures, seconds and unrounded hours. */
export interface WeekFigures {
  week: string;
  from: Date;
  to: Date;
  technicians: Map<number, TechnicianWeek>;
  /** Technician → job line → flagged hours, for the lines finished in the week (signed off where needed). */
  flagged: Map<number, Map<number, number>>;
  /** Job line → technician → seconds clocked on it up to the end of the week, for lines finished in it. */
  clockedToDate: Map<number, Map<number, number>>;
}

export function chunks<T>(list: readonly T[]): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < list.length; i += IN_CHUNK) out.push(list.slice(i, i + IN_CHUNK));
  return out;
}

/** Index of the first element ≥ `value` in an ascending array. */
function lowerBound(sorted: readonly number[], value: number): number {
  let [lo, hi] = [0, sorted.length];
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid]! < value) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

export const addTo = <K>(map: Map<K, number>, key: K, amount: number) =>
  map.set(key, (map.get(key) ?? 0) + amount);

export function getOrAdd<K, V>(map: Map<K, Map<number, V>>, key: K): Map<number, V> {
  let inner = map.get(key);
  if (!inner) map.set(key, (inner = new Map()));
  return inner;
}

export function technicianIdsOf(week: WeekFigures): number[] {
  return [...new Set([...week.technicians.keys(), ...week.flagged.keys()])];
}

/**
 * A technician's week in hours, unrounded. Efficiency's divisor is matched: all the time clocked on the lines
 * finished in the week, whenever it was; the time clocked this week on other lines is work in progress.
 */
export function hoursOf(week: WeekFigures, technicianId: number): LabourHours {
  const totals = week.technicians.get(technicianId)?.totals;
  const flaggedLines = week.flagged.get(technicianId) ?? new Map<number, number>();
  const flagged = [...flaggedLines.values()].reduce((sum, h) => sum + h, 0);
  let matched = 0;
  for (const lineId of flaggedLines.keys()) matched += week.clockedToDate.get(lineId)?.get(technicianId) ?? 0;
  let inProgress = 0;
  for (const [lineId, seconds] of Object.entries(totals?.jobSeconds ?? {}))
    if (!flaggedLines.has(Number(lineId))) inProgress += seconds;
  return {
    attendanceHours: (totals?.attendanceSeconds ?? 0) / HOUR_S,
    clockedHours: (totals?.clockedSeconds ?? 0) / HOUR_S,
    flaggedHours: flagged,
    matchedClockedHours: matched / HOUR_S,
    workInProgressHours: inProgress / HOUR_S,
  };
}

/**
 * The calendar helpers of `shared` work through time-zone-aware dates and take up to 2 ms a call; their
 * answers for a week never change, and a report asks for the same weeks again and again.
 */
const calendar = new Map<string, unknown>();
export function remember<T>(key: string, compute: () => T): T {
  if (calendar.size > 10_000) calendar.clear();
  if (!calendar.has(key)) calendar.set(key, compute());
  return calendar.get(key) as T;
}
const zoneKey = (settings: ShopSettings) =>
  `${settings.timeZone}|${settings.workweekStartDay}|${settings.workweekStartHour}`;
export const boundsOf = (label: string, settings: ShopSettings): TimeRange =>
  remember(`bounds|${label}|${zoneKey(settings)}`, () => workweekBounds(label, settings));
export const daysOf = (label: string, settings: ShopSettings): ShopDay[] =>
  remember(`days|${label}|${zoneKey(settings)}`, () => workweekDays(label, settings));

/**
 * Ledgers and flagged hours of consecutive workweeks. Punches are read for the weeks asked only (by the
 * indexed `at` column, with a lookback for shifts open at the start), and each workweek is computed from its
 * own slice of them, so the cost follows the weeks asked, not the length of the history.
 */
@Injectable()
export class WeekFiguresService {
  constructor(@Inject(DB) private readonly db: Db) {}

  /**
   * Figures of consecutive workweeks `labels` (oldest first). Flagged hours: the book hours of each line
   * finished in a week (`completedAt`), shared by the time each technician clocked on the line in all
   * (earlier weeks too), or to the assigned technician when nobody clocked on it. A line done with too
   * little clocked time counts only once a foreman signed it off.
   */
  figures(labels: readonly string[], settings: ShopSettings, now: Date): WeekFigures[] {
    const weeks = labels.map((week) => ({ week, ...boundsOf(week, settings) }));
    const first = weeks[0]!.from;
    const horizon = new Date(Math.min(weeks.at(-1)!.to.getTime(), now.getTime() + 1));
    // A plain scan of job_lines (no index on completed_at) beats walking the status index: most are done.
    const finished = this.db
      .select({
        id: jobLines.id,
        technicianId: jobLines.technicianId,
        bookHours: jobLines.bookHours,
        status: jobLines.status,
        queuedAt: jobLines.queuedAt,
        completedAt: jobLines.completedAt,
      })
      .from(jobLines)
      .where(
        and(
          gte(jobLines.completedAt, first),
          lt(jobLines.completedAt, horizon),
          or(isNull(jobLines.signOff), ne(jobLines.signOff, 'awaiting')),
        ),
      )
      .all()
      .filter((line) => line.status === 'done');
    const starts = weeks.map((week) => week.from.getTime());
    const finishedIn = weeks.map(() => [] as typeof finished);
    for (const line of finished)
      finishedIn[lowerBound(starts, line.completedAt!.getTime() + 1) - 1]?.push(line);
    const byTechnician = this.punchesBetween(new Date(first.getTime() - LOOKBACK_MS), horizon);
    const toDate = this.clockedBefore(
      first,
      finished.filter((line) => line.queuedAt < first).map((line) => line.id),
      settings,
    );

    return weeks.map(({ week, from, to }, index) => {
      const until = new Date(Math.min(to.getTime(), now.getTime()));
      const end = Math.min(to.getTime(), horizon.getTime());
      const technicians = new Map<number, TechnicianWeek>();
      for (const [technicianId, { ms, list }] of byTechnician) {
        const slice = list.slice(lowerBound(ms, from.getTime() - LOOKBACK_MS), lowerBound(ms, end));
        if (slice.length === 0) continue;
        const ledger = buildLedger(slice, until, settings);
        const totals = ledger.within(from, to);
        technicians.set(technicianId, { ledger, totals });
        for (const [lineId, seconds] of Object.entries(totals.jobSeconds))
          if (seconds > 0) addTo(getOrAdd(toDate, Number(lineId)), technicianId, seconds);
      }
      const flagged = new Map<number, Map<number, number>>();
      const clockedToDate = new Map<number, Map<number, number>>();
      for (const line of finishedIn[index]!) {
        const clocked = new Map(toDate.get(line.id) ?? []);
        clockedToDate.set(line.id, clocked);
        for (const [technicianId, share] of shareFlaggedHours(line.bookHours, clocked, line.technicianId))
          getOrAdd(flagged, technicianId).set(line.id, share);
      }
      return { week, from, to, technicians, flagged, clockedToDate };
    });
  }

  /** The first instant anyone clocked on each of the lines. */
  firstClockedOn(lineIds: readonly number[]): Map<number, Date> {
    const result = new Map<number, Date>();
    for (const part of chunks(lineIds))
      for (const row of this.db
        .select({ jobLineId: punches.jobLineId, at: min(punches.at) })
        .from(punches)
        .where(and(inArray(punches.jobLineId, part), eq(punches.kind, 'job-on')))
        .groupBy(punches.jobLineId)
        .all())
        if (row.jobLineId !== null && row.at) result.set(row.jobLineId, row.at);
    return result;
  }

  /** Effective punches at or after `from` and before `to`, per technician in time order. */
  private punchesBetween(from: Date, to: Date): Map<number, TechnicianPunches> {
    // Raw rows: a report reads tens of thousands of punches, and mapping each to an object costs more
    // than the query.
    const rows = this.db
      .select({
        id: punches.id,
        technicianId: punches.technicianId,
        kind: punches.kind,
        jobLineId: punches.jobLineId,
        breakKind: punches.breakKind,
        at: punches.at,
        supersedes: punches.supersedes,
        voids: punches.voids,
      })
      .from(punches)
      .where(and(gte(punches.at, from), lt(punches.at, to)))
      .orderBy(asc(punches.at))
      .values() as PunchValues[];
    // A correction can move a punch across a week boundary: drop what it replaced from every week.
    const superseded = new Set(rows.map((row) => row[6]).filter((id) => id !== null));
    const result = new Map<number, TechnicianPunches>();
    for (const [id, technicianId, kind, jobLineId, breakKind, at, supersedes, voids] of rows) {
      if (superseded.has(id) || voids) continue;
      let own = result.get(technicianId);
      if (!own) result.set(technicianId, (own = { ms: [], list: [] }));
      own.ms.push(at);
      own.list.push({
        id,
        technicianId,
        kind,
        jobLineId,
        breakKind,
        at: new Date(at).toISOString(),
        supersedes,
      });
    }
    return result;
  }

  /**
   * Seconds clocked before `first` on the given lines (finished in the weeks read, queued before them),
   * by line and technician: the part of a long job that lies before the weeks read.
   */
  private clockedBefore(
    first: Date,
    lineIds: readonly number[],
    settings: ShopSettings,
  ): Map<number, Map<number, number>> {
    const result = new Map<number, Map<number, number>>();
    const earliest = new Map<number, number>();
    for (const part of chunks(lineIds))
      for (const { technicianId, at } of this.db
        .select({ technicianId: punches.technicianId, at: min(punches.at) })
        .from(punches)
        .where(and(inArray(punches.jobLineId, part), lt(punches.at, first)))
        .groupBy(punches.technicianId)
        .all())
        if (at) earliest.set(technicianId, Math.min(at.getTime(), earliest.get(technicianId) ?? Infinity));
    for (const [technicianId, at] of earliest) {
      const own = this.db
        .select()
        .from(punches)
        .where(
          and(
            eq(punches.technicianId, technicianId),
            gte(punches.at, new Date(at - LOOKBACK_MS)),
            lt(punches.at, first),
          ),
        )
        .all()
        .map((row) => ({ ...row, at: row.at.toISOString() }));
      const before = buildLedger(own, first, settings).totals.jobSeconds;
      for (const [lineId, seconds] of Object.entries(before))
        if (seconds > 0) addTo(getOrAdd(result, Number(lineId)), technicianId, seconds);
    }
    return result;
  }
}
