import { setImmediate } from 'node:timers/promises';
import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gte, lt, min, or, isNull, ne, sql, type SQL } from 'drizzle-orm';
import type { SQLiteColumn } from 'drizzle-orm/sqlite-core';
import {
  buildLedger,
  ledgerSettingsKey,
  secondsOf,
  shareFlaggedHours,
  shopLabourSeconds,
  wholeSeconds,
  workweekBounds,
  workweekDays,
  type LabourSeconds,
  type Ledger,
  type LedgerPunch,
  type LedgerSettings,
  type LedgerTotals,
  type ShopDay,
  type ShopSettings,
  type TimeRange,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { inTransaction } from '../db/in-transaction.js';
import { jobLines, punches, users } from '../db/schema/index.js';
import { LEDGER_PUNCH_COLUMNS, toLedgerPunch, type LedgerPunchValues } from '../labour/labour.service.js';
import { counts, notReplaced, prepareReadFrom } from '../punches/last-shift-out.js';
import { ShopService } from '../shop/shop.service.js';
import { EVERYTHING_CHANGED, WeekChanges } from './week-changes.js';

/**
 * A week's punches are read from this long before it (as timecards do), and further back, to the shift-out
 * before it, for a technician whose shift was still open then.
 */
export const LOOKBACK_MS = 36 * 3600_000;
export const HOUR_S = 3600;

/** Weeks whose full figures are kept: a report's week and a few around it, and the running week. */
const FIGURES_KEPT = 7;
/** Past weeks whose shop hours are kept for the trend (about five years). */
const SHOP_HOURS_KEPT = 260;

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

/** `column` is one of `ids`, given as one JSON parameter: no limit on their number, nothing to build per id. */
export function inIds(column: SQLiteColumn, ids: readonly number[]): SQL {
  return sql`${column} in (select value from json_each(${JSON.stringify(ids)}))`;
}

/**
 * Where a week's slice of a technician's punches starts: `LOOKBACK_MS` before the week, or at the shift-out
 * before the shift that was open then (the list's start when it holds none).
 */
function sliceStart({ ms, list }: TechnicianPunches, from: number): number {
  const lookback = lowerBound(ms, from - LOOKBACK_MS);
  let i = lookback - 1;
  while (i >= 0 && list[i]!.kind !== 'shift-in' && list[i]!.kind !== 'shift-out') i--;
  if (i < 0 || list[i]!.kind === 'shift-out') return lookback;
  while (i >= 0 && list[i]!.kind !== 'shift-out') i--;
  return Math.max(i, 0);
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

export function technicianIdsOf(week: Pick<WeekFigures, 'technicians' | 'flagged'>): number[] {
  return [...new Set([...week.technicians.keys(), ...week.flagged.keys()])];
}

/**
 * A technician's week in whole seconds, each figure rounded once from its exact sum: the pay summary is worked
 * out from the same figures. Efficiency's divisor is matched: all the time clocked on the lines finished in the
 * week, whenever it was; the time clocked this week on other lines is work in progress.
 */
export function labourSecondsOf(week: WeekFigures, technicianId: number): LabourSeconds {
  const totals = week.technicians.get(technicianId)?.totals;
  const flaggedLines = week.flagged.get(technicianId) ?? new Map<number, number>();
  const flagged = [...flaggedLines.values()].reduce((sum, h) => sum + h, 0);
  let matched = 0;
  for (const lineId of flaggedLines.keys()) matched += week.clockedToDate.get(lineId)?.get(technicianId) ?? 0;
  let inProgress = 0;
  for (const [lineId, seconds] of Object.entries(totals?.jobSeconds ?? {}))
    if (!flaggedLines.has(Number(lineId))) inProgress += seconds;
  return {
    attendanceSeconds: wholeSeconds(totals?.attendanceSeconds ?? 0),
    clockedSeconds: wholeSeconds(totals?.clockedSeconds ?? 0),
    flaggedSeconds: secondsOf(flagged),
    matchedClockedSeconds: wholeSeconds(matched),
    workInProgressSeconds: wholeSeconds(inProgress),
  };
}

/** The first instant (ms) anyone clocked on the line `lineId`, null if nobody did: the start of its punches. */
export function firstJobOn(lineId: SQL | SQLiteColumn): SQL<number | null> {
  return sql<number | null>`(
    select at from ${punches} where job_line_id = ${lineId} and kind = 'job-on' order by at limit 1
  )`;
}

/** The shop's seconds of a week: every technician with figures in it counts, whoever is listed today. */
export function shopSecondsOf(week: WeekFigures): LabourSeconds {
  return shopLabourSeconds(technicianIdsOf(week).map((id) => labourSecondsOf(week, id)));
}

/** The settings a week's figures depend on: where the week falls, and how a ledger counts. */
function figuresSettingsKey(settings: ShopSettings, ledger: LedgerSettings): string {
  return JSON.stringify([
    settings.timeZone,
    settings.workweekStartDay,
    settings.workweekStartHour,
    ledgerSettingsKey(ledger),
  ]);
}

/**
 * Values of weeks by week label; beyond `limit`, the least recently used go first. A week counted after its
 * end keeps its value; one counted while it ran holds only for the instant it was counted at (its open
 * shifts count up to that instant), so a request that reads the running week twice counts it once.
 */
class KeptWeeks<T> {
  private readonly weeks = new Map<string, { to: number; countedAt: number; value: T }>();

  constructor(private readonly limit: number) {}

  /**
   * The value kept under `key` (a week's label, or more), when it was counted after its week and `now` is
   * too, or it was counted at `now`.
   */
  get(key: string, now: Date): T | undefined {
    const kept = this.weeks.get(key);
    if (!kept) return undefined;
    const whole = kept.countedAt >= kept.to && now.getTime() >= kept.to;
    if (!whole && kept.countedAt !== now.getTime()) return undefined;
    this.weeks.delete(key);
    this.weeks.set(key, kept);
    return kept.value;
  }

  /** Keeps under `key` a value of the week ending at `to`, counted at `now`. */
  keep(key: string, to: Date, now: Date, value: T): void {
    this.weeks.delete(key);
    this.weeks.set(key, { to: to.getTime(), countedAt: now.getTime(), value });
    if (this.weeks.size > this.limit) this.weeks.delete(this.weeks.keys().next().value!);
  }

  /** Forgets every week that ends after `instant`. */
  forgetAfter(instant: number): void {
    for (const [label, { to }] of this.weeks) if (to > instant) this.weeks.delete(label);
  }
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
 * own slice of them, so the cost follows the weeks asked, not the length of the history. The figures of a
 * week that is over are kept until a change reaches back into it (`WeekChanges`) or a setting they depend
 * on changes: a late punch, a correction, a line finished, edited or reopened in it or before it. The running
 * week's are kept for the instant they were counted at, until any change.
 */
@Injectable()
export class WeekFiguresService {
  private readonly changes: WeekChanges;
  private readonly keptFigures = new KeptWeeks<WeekFigures>(FIGURES_KEPT);
  /** One technician's figures of a week (`figuresOf`), under `week|technicianId`. */
  private readonly keptOwnFigures = new KeptWeeks<WeekFigures>(FIGURES_KEPT);
  private readonly keptShopSeconds = new KeptWeeks<LabourSeconds>(SHOP_HOURS_KEPT);
  private keptFor = '';
  private readonly readFrom: ReturnType<typeof prepareReadFrom>;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
  ) {
    this.changes = new WeekChanges(db);
    this.readFrom = prepareReadFrom(db);
  }

  /**
   * Figures of consecutive workweeks `labels` (oldest first). `passing`: weeks read on the way to another's
   * figures, taken where kept but not kept themselves (a long run of them would push out the weeks reported).
   */
  figures(labels: readonly string[], settings: ShopSettings, now: Date, passing = false): WeekFigures[] {
    return this.read(this.keptFigures, !passing, labels, settings, now, (week) => week);
  }

  /**
   * Figures of workweek `label` to read one technician's seconds from (`labourSecondsOf`): the whole shop's when they
   * are kept, else worked out for the technician and whoever shares a line finished in the week with them
   * (their time shares its book hours). A timecard or a kiosk's week of the running week asks for this
   * at every instant, and the whole shop's week costs tens of milliseconds on years of punches.
   */
  figuresOf(label: string, technicianId: number, settings: ShopSettings, now: Date): WeekFigures {
    if (inTransaction(this.db)) return this.compute([label], settings, now, technicianId)[0]!;
    this.forgetChanged(settings);
    const key = `${label}|${technicianId}`;
    const kept = this.keptFigures.get(label, now) ?? this.keptOwnFigures.get(key, now);
    if (kept) return kept;
    const own = this.compute([label], settings, now, technicianId)[0]!;
    this.keptOwnFigures.keep(key, own.to, now, own);
    return own;
  }

  /** The shop's seconds of consecutive workweeks `labels` (oldest first), as `shopSecondsOf`. */
  shopSeconds(labels: readonly string[], settings: ShopSettings, now: Date): LabourSeconds[] {
    return this.read(this.keptShopSeconds, true, labels, settings, now, shopSecondsOf);
  }

  /**
   * Computes and keeps the shop seconds of the weeks `labels` that are not kept, one week a turn of the event
   * loop, so that whatever waits (a punch, a socket) is served between the weeks rather than after them all;
   * it stops between two weeks once `stopped` says so (the server is going down).
   */
  async keepShopSecondsInTurns(
    labels: readonly string[],
    settings: ShopSettings,
    now: Date,
    stopped = () => false,
  ): Promise<void> {
    for (const label of labels) {
      this.forgetChanged(settings);
      if (this.keptShopSeconds.get(label, now) !== undefined) continue;
      await setImmediate();
      if (stopped()) return;
      this.shopSeconds([label], settings, now);
    }
  }

  /** The kept values of the weeks, the others computed together (the run from the first to the last missing). */
  private read<T>(
    kept: KeptWeeks<T>,
    keepComputed: boolean,
    labels: readonly string[],
    settings: ShopSettings,
    now: Date,
    valueOf: (week: WeekFigures) => T,
  ): T[] {
    // Inside a transaction the rows may yet be rolled back: nothing kept is read or kept.
    if (inTransaction(this.db)) return this.compute(labels, settings, now).map(valueOf);
    this.forgetChanged(settings);
    const found = labels.map((label) => kept.get(label, now));
    const first = found.indexOf(undefined);
    if (first < 0) return found as T[];
    const computed = this.compute(labels.slice(first, found.lastIndexOf(undefined) + 1), settings, now).map(
      (week) => {
        const value = valueOf(week);
        if (keepComputed) kept.keep(week.week, week.to, now, value);
        // Whatever was asked for, the week's shop seconds are kept for the trend: once.
        if (kept !== this.keptShopSeconds)
          this.keptShopSeconds.keep(week.week, week.to, now, shopSecondsOf(week));
        return value;
      },
    );
    return labels.map((_, i) => found[i] ?? computed[i - first]!);
  }

  private forgetChanged(settings: ShopSettings): void {
    const changed = this.changes.since();
    const key = figuresSettingsKey(settings, this.shop.ledgerSettings());
    const since = key === this.keptFor ? changed : EVERYTHING_CHANGED;
    this.keptFor = key;
    if (since === null) return;
    this.keptFigures.forgetAfter(since);
    this.keptOwnFigures.forgetAfter(since);
    this.keptShopSeconds.forgetAfter(since);
  }

  /**
   * Figures of consecutive workweeks `labels` (oldest first). Flagged hours: the book hours of each line
   * finished in a week (`completedAt`), shared by the time each technician clocked on the line in all
   * (earlier weeks too), or to the assigned technician when nobody clocked on it. A line done with too
   * little clocked time counts only once a foreman signed it off. With `only`, the figures hold that
   * technician's lines and those who share them, which is all that technician's hours are read from.
   */
  private compute(
    labels: readonly string[],
    settings: ShopSettings,
    now: Date,
    only?: number,
  ): WeekFigures[] {
    const weeks = labels.map((week) => ({ week, ...boundsOf(week, settings) }));
    const first = weeks[0]!.from;
    const horizon = new Date(Math.min(weeks.at(-1)!.to.getTime(), now.getTime() + 1));
    const allFinished = this.db
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
    const { finished, technicianIds } =
      only === undefined
        ? { finished: allFinished, technicianIds: undefined }
        : this.sharing(only, allFinished);
    const starts = weeks.map((week) => week.from.getTime());
    const finishedIn = weeks.map(() => [] as typeof finished);
    for (const line of finished)
      finishedIn[lowerBound(starts, line.completedAt!.getTime() + 1) - 1]?.push(line);
    const lookback = first.getTime() - LOOKBACK_MS;
    const byTechnician = this.punchesBetween(new Date(lookback), horizon, technicianIds);
    for (const technicianId of this.onShiftAt(lookback)) {
      if (technicianIds && !technicianIds.includes(technicianId)) continue;
      const earlier = this.punchesBetween(
        new Date(this.readFrom(technicianId, lookback)),
        new Date(lookback),
        [technicianId],
      ).get(technicianId);
      if (!earlier) continue;
      const later = byTechnician.get(technicianId);
      byTechnician.set(technicianId, {
        ms: [...earlier.ms, ...(later?.ms ?? [])],
        list: [...earlier.list, ...(later?.list ?? [])],
      });
    }
    const toDate = this.clockedBefore(
      first,
      finished.filter((line) => line.queuedAt < first).map((line) => line.id),
    );

    return weeks.map(({ week, from, to }, index) => {
      const until = new Date(Math.min(to.getTime(), now.getTime()));
      const end = Math.min(to.getTime(), horizon.getTime());
      const technicians = new Map<number, TechnicianWeek>();
      for (const [technicianId, { ms, list }] of byTechnician) {
        const slice = list.slice(sliceStart({ ms, list }, from.getTime()), lowerBound(ms, end));
        if (slice.length === 0) continue;
        const ledger = buildLedger(slice, until, this.shop.ledgerSettings());
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

  /**
   * Of the finished lines, those the technician clocked on or was assigned, and everyone who clocked on
   * them (the technician first).
   */
  private sharing<Line extends { id: number; technicianId: number | null }>(
    technicianId: number,
    finished: readonly Line[],
  ): { finished: Line[]; technicianIds: number[] } {
    const lineIds = finished.map((line) => line.id);
    const clockedBy = new Map<number, number[]>();
    for (const row of this.db
      .selectDistinct({ jobLineId: punches.jobLineId, technicianId: punches.technicianId })
      .from(punches)
      .where(inIds(punches.jobLineId, lineIds))
      .all())
      clockedBy.set(row.jobLineId!, [...(clockedBy.get(row.jobLineId!) ?? []), row.technicianId]);
    const own = finished.filter(
      (line) => line.technicianId === technicianId || clockedBy.get(line.id)?.includes(technicianId),
    );
    const technicianIds = new Set([technicianId, ...own.flatMap((line) => clockedBy.get(line.id) ?? [])]);
    return { finished: own, technicianIds: [...technicianIds] };
  }

  /** Technicians whose last counting shift punch before `instant` is a shift-in: on shift then. */
  private onShiftAt(instant: number): number[] {
    const rows = this.db.all<{ technicianId: number }>(sql`
      select id as technicianId from ${users} technician
      where technician.role = 'technician' and (
        select kind from ${punches} shift
        where shift.technician_id = technician.id and shift.kind in ('shift-in', 'shift-out')
          and shift.at < ${instant} and ${counts('shift')}
        order by shift.at desc limit 1
      ) = 'shift-in'`);
    return rows.map((row) => row.technicianId);
  }

  /** The first instant anyone clocked on each of the lines. */
  firstClockedOn(lineIds: readonly number[]): Map<number, Date> {
    const rows = this.db.all<{ jobLineId: number; at: number | null }>(
      sql`select value as jobLineId, ${firstJobOn(sql`value`)} as at from json_each(${JSON.stringify(lineIds)})`,
    );
    return new Map(rows.filter((row) => row.at !== null).map((row) => [row.jobLineId, new Date(row.at!)]));
  }

  /**
   * Effective punches at or after `from` and before `to`, per technician in time order. A punch corrected
   * by a later row is left out wherever the correction lies (a correction can move a punch across a week
   * boundary), so a week's figures are the same whichever weeks are read with it.
   */
  private punchesBetween(
    from: Date,
    to: Date,
    technicianIds?: readonly number[],
  ): Map<number, TechnicianPunches> {
    // Raw rows: a report reads tens of thousands of punches, and mapping each to an object costs more
    // than the query.
    const rows = this.db
      .select(LEDGER_PUNCH_COLUMNS)
      .from(punches)
      .where(
        and(
          technicianIds && inIds(punches.technicianId, technicianIds),
          gte(punches.at, from),
          lt(punches.at, to),
          notReplaced('punches'),
        ),
      )
      .orderBy(asc(punches.at))
      .values() as LedgerPunchValues[];
    const result = new Map<number, TechnicianPunches>();
    for (const row of rows) {
      const [, technicianId, , , , at, , voids] = row;
      if (voids) continue;
      let own = result.get(technicianId);
      if (!own) result.set(technicianId, (own = { ms: [], list: [] }));
      own.ms.push(at);
      own.list.push(toLedgerPunch(row));
    }
    return result;
  }

  /**
   * Seconds clocked before `first` on the given lines (finished in the weeks read, queued before them),
   * by line and technician: the part of a long job that lies before the weeks read.
   */
  private clockedBefore(first: Date, lineIds: readonly number[]): Map<number, Map<number, number>> {
    const result = new Map<number, Map<number, number>>();
    const earliest = new Map<number, number>();
    for (const { technicianId, at } of this.db
      .select({ technicianId: punches.technicianId, at: min(punches.at) })
      .from(punches)
      .where(and(inIds(punches.jobLineId, lineIds), lt(punches.at, first)))
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
            gte(punches.at, new Date(this.readFrom(technicianId, at, LOOKBACK_MS))),
            lt(punches.at, first),
          ),
        )
        .all()
        .map((row) => ({ ...row, at: row.at.toISOString() }));
      const before = buildLedger(own, first, this.shop.ledgerSettings()).totals.jobSeconds;
      for (const [lineId, seconds] of Object.entries(before))
        if (seconds > 0) addTo(getOrAdd(result, Number(lineId)), technicianId, seconds);
    }
    return result;
  }
}
