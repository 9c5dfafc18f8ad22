import { Inject, Injectable, type OnModuleDestroy, type StreamableFile } from '@nestjs/common';
import { and, asc, count, eq, gte, inArray, isNotNull, lt, max, min, ne, or, sql } from 'drizzle-orm';
import type { Subscription } from 'rxjs';
import {
  addIsoWeeks,
  buildLedger,
  estimateWeeklyPay,
  KPI_FORMULAS,
  KPI_GUIDELINES,
  KPI_NAMES_NOTE,
  LABOUR_TREND_WEEKS,
  labourKpis,
  NEAR_OVERTIME_HOURS,
  PAY_ESTIMATE_CAUTION,
  shareFlaggedHours,
  shopLabourKpis,
  shopLocalInstant,
  workweekBounds,
  workweekDays,
  workweekOf,
  type BayUtilisation,
  type BreakKind,
  type LabourHours,
  type LabourReport,
  type LabourReportLine,
  type LabourReportRow,
  type LabourReportTechnician,
  type Ledger,
  type LedgerPunch,
  type LedgerSettings,
  type LedgerTotals,
  type PayReport,
  type PayReportTechnician,
  type PayReportTotals,
  type PunchKind,
  type ReportQuery,
  type ShopDay,
  type ShopSettings,
  type TimeRange,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { bays, jobLines, punches, repairOrders, users } from '../db/schema/index.js';
import { LiveService } from '../live/live.service.js';
import { ShopService } from '../shop/shop.service.js';
import { labourCsv, payCsv } from './reports.csv.js';

/** A shift still open at the start of a week began before it: look back this far for it (as timecards do). */
const LOOKBACK_MS = 36 * 3600_000;
/** Project a running week's hours only once a working day of opening hours has passed. */
const PROJECTION_MIN_OPEN_MS = 8 * 3600_000;
/** Finished weeks kept for the trend before the cache starts over (about five years). */
const TREND_CACHE_LIMIT = 260;
/** Bound on the ids in one `IN (…)` list (SQLite allows 32,766 parameters). */
const IN_CHUNK = 5000;

const HOUR_S = 3600;
const roundTo = (value: number, places: number) => Math.round(value * 10 ** places) / 10 ** places;
const hours = (value: number) => roundTo(value, 4);
const ratio = (value: number | null) => (value === null ? null : roundTo(value, 6));

function present(row: LabourReportRow): LabourReportRow {
  return {
    attendanceHours: hours(row.attendanceHours),
    clockedHours: hours(row.clockedHours),
    flaggedHours: hours(row.flaggedHours),
    productivity: ratio(row.productivity),
    efficiency: ratio(row.efficiency),
    proficiency: ratio(row.proficiency),
  };
}

function chunks<T>(list: readonly T[]): T[][] {
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

const addTo = <K>(map: Map<K, number>, key: K, amount: number) => map.set(key, (map.get(key) ?? 0) + amount);

type PunchValues = [
  id: string,
  technicianId: number,
  kind: PunchKind,
  jobLineId: number | null,
  breakKind: BreakKind | null,
  at: number,
  supersedes: string | null,
];

interface TechnicianPunches {
  ms: number[];
  list: LedgerPunch[];
}

interface TechnicianWeek {
  ledger: Ledger;
  /** The ledger clipped to the workweek. */
  totals: LedgerTotals;
}

/** One workweek's raw figures, seconds and unrounded hours. */
interface WeekFigures {
  week: string;
  from: Date;
  to: Date;
  technicians: Map<number, TechnicianWeek>;
  /** Technician → job line → flagged hours, for the lines finished in the week. */
  flagged: Map<number, Map<number, number>>;
  /** Job line → technician → seconds clocked on it up to the end of the week, for lines finished in it. */
  clockedToDate: Map<number, Map<number, number>>;
}

interface Technician {
  id: number;
  name: string;
  flatRateCents: number;
  hourlyRateCents: number;
  overtimeExempt: boolean;
}

/**
 * The weekly labour report and the pay summary. Punches are read for the weeks asked only (by the
 * indexed `at` column, with a lookback for shifts open at the start), and each workweek is computed from
 * its own slice of them, so the cost follows the weeks shown, not the length of the history.
 */
@Injectable()
export class ReportsService implements OnModuleDestroy {
  /** Shop hours of finished workweeks, by week label; valid while `trendStamp` holds. */
  private readonly trendCache = new Map<string, LabourHours>();
  private trendStamp = '';
  private readonly subscription: Subscription;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
    live: LiveService,
  ) {
    this.subscription = live.floorChanged$.subscribe(() => this.trendCache.clear());
  }

  onModuleDestroy(): void {
    this.subscription.unsubscribe();
  }

  labourAnswer({ week, format }: ReportQuery): LabourReport | StreamableFile {
    const report = this.labour(week);
    return format === 'csv' ? labourCsv(report) : report;
  }

  payAnswer({ week, format }: ReportQuery): PayReport | StreamableFile {
    const report = this.pay(week);
    return format === 'csv' ? payCsv(report) : report;
  }

  /** The labour report of the shop workweek that starts in ISO week `week` (default: the one running now). */
  labour(week?: string, now = new Date()): LabourReport {
    const settings = this.shop.settings();
    const label = week ?? workweekOf(now, settings);
    const labels = Array.from({ length: LABOUR_TREND_WEEKS }, (_, i) =>
      remember(`add|${label}|${i}`, () => addIsoWeeks(label, i + 1 - LABOUR_TREND_WEEKS)),
    );
    const { figures, trend } = this.trendFigures(labels, settings, now);
    const current = figures.at(-1)!;
    const people = this.technicians(current);
    const lineIds = new Set<number>();
    for (const { totals } of current.technicians.values())
      for (const [id, seconds] of Object.entries(totals.jobSeconds)) if (seconds > 0) lineIds.add(Number(id));
    for (const lines of current.flagged.values()) for (const id of lines.keys()) lineIds.add(id);
    const lineInfo = this.lineInfo([...lineIds]);

    const rows = people.map((person) => ({ person, hours: hoursOf(current, person.id) }));
    const technicians: LabourReportTechnician[] = rows.map(({ person, hours: row }) => {
      const jobSeconds = current.technicians.get(person.id)?.totals.jobSeconds ?? {};
      const flagged = current.flagged.get(person.id) ?? new Map<number, number>();
      const ids = new Set([
        ...Object.entries(jobSeconds)
          .filter(([, seconds]) => seconds > 0)
          .map(([id]) => Number(id)),
        ...flagged.keys(),
      ]);
      const lines = [...ids]
        .sort((a, b) => a - b)
        .map((id): LabourReportLine => {
          const info = lineInfo.get(id);
          const share = flagged.get(id);
          const toDate = current.clockedToDate.get(id)?.get(person.id) ?? 0;
          return {
            jobLineId: id,
            repairOrderNumber: info?.number ?? '?',
            title: info?.title ?? '?',
            bookHours: info?.bookHours ?? 0,
            flaggedHours: hours(share ?? 0),
            clockedHours: hours((jobSeconds[id] ?? 0) / HOUR_S),
            overUnderHours: share === undefined ? null : hours(share - toDate / HOUR_S),
          };
        });
      return { technicianId: person.id, name: person.name, ...present(labourKpis(row)), lines };
    });

    return {
      week: label,
      from: current.from.toISOString(),
      to: current.to.toISOString(),
      timeZone: settings.timeZone,
      technicians,
      shop: present(shopLabourKpis(rows.map((row) => row.hours))),
      formulas: KPI_FORMULAS,
      guidelines: KPI_GUIDELINES,
      namesNote: KPI_NAMES_NOTE,
      trend: labels.map((week, i) => ({ week, ...present(labourKpis(trend[i]!)) })),
      bayUtilisation: this.bayUtilisation(label, current, settings, now),
    };
  }

  /**
   * Figures of the weeks from the earliest one not in the trend cache to the last (the report's own),
   * and the shop's hours of every week. A finished week's hours are kept until any punch, job line or
   * shop setting changes (a live floor change, a new punch row, a changed line), so the eleven weeks
   * before the report's are read once, not on every report.
   */
  private trendFigures(
    labels: readonly string[],
    settings: ShopSettings,
    now: Date,
  ): { figures: WeekFigures[]; trend: LabourHours[] } {
    const stamp = this.dataStamp(settings);
    if (stamp !== this.trendStamp || this.trendCache.size > TREND_CACHE_LIMIT) {
      this.trendCache.clear();
      this.trendStamp = stamp;
    }
    const last = labels.length - 1;
    const uncached = labels.findIndex(
      (label, i) => i === last || !this.trendCache.has(label) || boundsOf(label, settings).to > now,
    );
    const figures = this.figures(labels.slice(uncached), settings, now);
    const computed = new Map<string, LabourHours>();
    for (const week of figures) {
      // Every technician with figures that week counts in the shop's trend, whoever is listed today.
      const hoursOfShop = shopLabourKpis(technicianIdsOf(week).map((id) => hoursOf(week, id)));
      if (week.to <= now) this.trendCache.set(week.week, hoursOfShop);
      else this.trendCache.delete(week.week);
      computed.set(week.week, hoursOfShop);
    }
    const trend = labels.map((label) => computed.get(label) ?? this.trendCache.get(label)!);
    return { figures, trend };
  }

  /** Changes whenever a punch is added, a job line is added or changed, or a setting that shapes weeks. */
  private dataStamp(settings: ShopSettings): string {
    const punchRows =
      this.db
        .select({ last: max(sql<number>`rowid`) })
        .from(punches)
        .get()?.last ?? 0;
    const lines = this.db
      .select({ count: count(), updated: max(jobLines.updatedAt) })
      .from(jobLines)
      .get();
    const { timeZone, workweekStartDay, workweekStartHour, concurrentSplit, maxConcurrentJobs } = settings;
    return JSON.stringify([
      punchRows,
      lines?.count ?? 0,
      lines?.updated?.getTime() ?? 0,
      timeZone,
      workweekStartDay,
      workweekStartHour,
      concurrentSplit,
      maxConcurrentJobs,
    ]);
  }

  /** The pay summary of the shop workweek that starts in ISO week `week` (default: the one running now). */
  pay(week?: string, now = new Date()): PayReport {
    const settings = this.shop.settings();
    const label = week ?? workweekOf(now, settings);
    const current = this.figures([label], settings, now)[0]!;
    const days = daysOf(label, settings);
    const running = now >= current.from && now < current.to;
    const { elapsedMs, totalMs } = openingProgress(days, settings, now);

    const technicians = this.technicians(current).map((person): PayReportTechnician => {
      const week = current.technicians.get(person.id);
      const worked = hoursOf(current, person.id);
      const estimate = estimateWeeklyPay(
        {
          flaggedHours: worked.flaggedHours,
          flatRateCents: person.flatRateCents,
          hoursWorked: worked.attendanceHours,
          nonProductiveHours: (week?.totals.idleSeconds ?? 0) / HOUR_S,
          restHours: (week?.totals.restBreakSeconds ?? 0) / HOUR_S,
          hourlyRateCents: person.hourlyRateCents,
          overtimeExempt: person.overtimeExempt,
          dailyHours: days.map((day) =>
            week ? week.ledger.within(day.from, day.to).attendanceSeconds / HOUR_S : 0,
          ),
        },
        settings,
      );
      // 29 USC 213(b)(10)(A) exempts from federal overtime only; California's daily overtime still applies.
      const overtimeApplies = settings.overtimeRules === 'california' || !person.overtimeExempt;
      const projected =
        elapsedMs >= PROJECTION_MIN_OPEN_MS ? (worked.attendanceHours * totalMs) / elapsedMs : 0;
      return {
        technicianId: person.id,
        name: person.name,
        flatRateCents: person.flatRateCents,
        hourlyRateCents: person.hourlyRateCents,
        overtimeExempt: person.overtimeExempt,
        flaggedHours: hours(worked.flaggedHours),
        flaggedPayCents: estimate.flaggedPayCents,
        nonProductivePayCents: estimate.nonProductivePayCents,
        straightTimeCents: estimate.straightTimeCents,
        hoursWorked: hours(estimate.hoursWorked),
        regularRateCents: estimate.regularRateCents,
        overtimeHours: hours(estimate.overtimeHours),
        doubleTimeHours: hours(estimate.doubleTimeHours),
        overtimePremiumCents: estimate.overtimePremiumCents,
        minimumWageTopUpCents: estimate.minimumWageTopUpCents,
        totalCents: estimate.totalCents,
        underMinimumWage: estimate.minimumWageTopUpCents > 0,
        nearOvertime:
          running && overtimeApplies && Math.max(worked.attendanceHours, projected) >= NEAR_OVERTIME_HOURS,
      };
    });

    const sum = (pick: (row: PayReportTechnician) => number) =>
      technicians.reduce((total, row) => total + pick(row), 0);
    const totals: PayReportTotals = {
      flaggedHours: hours(sum((row) => row.flaggedHours)),
      hoursWorked: hours(sum((row) => row.hoursWorked)),
      overtimeHours: hours(sum((row) => row.overtimeHours)),
      doubleTimeHours: hours(sum((row) => row.doubleTimeHours)),
      flaggedPayCents: sum((row) => row.flaggedPayCents),
      nonProductivePayCents: sum((row) => row.nonProductivePayCents),
      straightTimeCents: sum((row) => row.straightTimeCents),
      overtimePremiumCents: sum((row) => row.overtimePremiumCents),
      minimumWageTopUpCents: sum((row) => row.minimumWageTopUpCents),
      totalCents: sum((row) => row.totalCents),
    };
    return {
      week: label,
      from: current.from.toISOString(),
      to: current.to.toISOString(),
      timeZone: settings.timeZone,
      rules: settings.overtimeRules,
      minimumWageCents: settings.minimumWageCents,
      caution: PAY_ESTIMATE_CAUTION,
      technicians,
      totals,
    };
  }

  /**
   * Ledgers and flagged hours for consecutive workweeks `labels` (oldest first). Flagged hours: the book
   * hours of each line finished in a week (`completedAt`), shared by the time each technician clocked on
   * the line in all (earlier weeks too), or to the assigned technician when nobody clocked on it.
   */
  private figures(labels: readonly string[], settings: ShopSettings, now: Date): WeekFigures[] {
    const split: LedgerSettings = {
      concurrentSplit: settings.concurrentSplit,
      maxConcurrentJobs: settings.maxConcurrentJobs,
    };
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
      .where(and(gte(jobLines.completedAt, first), lt(jobLines.completedAt, horizon)))
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
      split,
    );

    return weeks.map(({ week, from, to }, index) => {
      const until = new Date(Math.min(to.getTime(), now.getTime()));
      const end = Math.min(to.getTime(), horizon.getTime());
      const technicians = new Map<number, TechnicianWeek>();
      for (const [technicianId, { ms, list }] of byTechnician) {
        const slice = list.slice(lowerBound(ms, from.getTime() - LOOKBACK_MS), lowerBound(ms, end));
        if (slice.length === 0) continue;
        const ledger = buildLedger(slice, until, split);
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
      })
      .from(punches)
      .where(and(gte(punches.at, from), lt(punches.at, to)))
      .orderBy(asc(punches.at))
      .values() as PunchValues[];
    // A correction can move a punch across a week boundary: drop what it replaced from every week.
    const superseded = new Set(rows.map((row) => row[6]).filter((id) => id !== null));
    const result = new Map<number, TechnicianPunches>();
    for (const [id, technicianId, kind, jobLineId, breakKind, at, supersedes] of rows) {
      if (superseded.has(id)) continue;
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
    split: LedgerSettings,
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
      const before = buildLedger(own, first, split).totals.jobSeconds;
      for (const [lineId, seconds] of Object.entries(before))
        if (seconds > 0) addTo(getOrAdd(result, Number(lineId)), technicianId, seconds);
    }
    return result;
  }

  /** Active technicians on the books by the end of the week, and anyone with figures in it; by name. */
  private technicians(week: WeekFigures): Technician[] {
    const withFigures = new Set(technicianIdsOf(week));
    return this.db
      .select()
      .from(users)
      .where(eq(users.role, 'technician'))
      .orderBy(asc(users.name), asc(users.id))
      .all()
      .filter((user) => withFigures.has(user.id) || (user.active && user.createdAt < week.to))
      .map(({ id, name, flatRateCents, hourlyRateCents, overtimeExempt }) => ({
        id,
        name,
        flatRateCents,
        hourlyRateCents,
        overtimeExempt,
      }));
  }

  private lineInfo(ids: number[]): Map<number, { title: string; bookHours: number; number: string }> {
    const result = new Map<number, { title: string; bookHours: number; number: string }>();
    for (const part of chunks(ids))
      for (const row of this.db
        .select({
          id: jobLines.id,
          title: jobLines.title,
          bookHours: jobLines.bookHours,
          number: repairOrders.number,
        })
        .from(jobLines)
        .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
        .where(inArray(jobLines.id, part))
        .all())
        result.set(row.id, row);
    return result;
  }

  /**
   * Share of each day's opening hours each bay was not `free`. The database keeps a bay's current phase
   * only, not its history, so occupancy is rebuilt from the job lines now in the bay: from the first
   * job-on punch on a line (its queuedAt when nobody clocked on it) to its completedAt, or to now while
   * it is not done. This misses time a finished car stood in `check` or `ready`, and a line moved to
   * another bay counts in the bay it is in now.
   */
  private bayUtilisation(
    label: string,
    week: Pick<WeekFigures, 'from' | 'to'>,
    settings: ShopSettings,
    now: Date,
  ): BayUtilisation[] {
    const end = new Date(Math.min(week.to.getTime(), now.getTime()));
    const allBays = this.db
      .select({ id: bays.id, name: bays.name })
      .from(bays)
      .where(eq(bays.active, true))
      .orderBy(asc(bays.position), asc(bays.id))
      .all();
    const lines = this.db
      .select({
        id: jobLines.id,
        bayId: jobLines.bayId,
        status: jobLines.status,
        queuedAt: jobLines.queuedAt,
        completedAt: jobLines.completedAt,
      })
      .from(jobLines)
      .where(
        and(
          isNotNull(jobLines.bayId),
          lt(jobLines.queuedAt, end),
          or(ne(jobLines.status, 'done'), gte(jobLines.completedAt, week.from)),
        ),
      )
      .all();
    const firstOn = new Map<number, number>();
    for (const part of chunks(lines.map((line) => line.id)))
      for (const row of this.db
        .select({ jobLineId: punches.jobLineId, at: min(punches.at) })
        .from(punches)
        .where(and(inArray(punches.jobLineId, part), eq(punches.kind, 'job-on')))
        .groupBy(punches.jobLineId)
        .all())
        if (row.jobLineId !== null && row.at) firstOn.set(row.jobLineId, row.at.getTime());

    const busy = new Map<number, [number, number][]>();
    for (const line of lines) {
      const start = firstOn.get(line.id) ?? line.queuedAt.getTime();
      const stop = Math.min(
        line.status === 'done' && line.completedAt ? line.completedAt.getTime() : now.getTime(),
        now.getTime(),
      );
      if (stop > start) busy.set(line.bayId!, [...(busy.get(line.bayId!) ?? []), [start, stop]]);
    }
    const windows = daysOf(label, settings).map((day) => ({
      day: day.day,
      open: openWindow(day, settings, now),
    }));
    return allBays.map((bay) => {
      const spans = merge(busy.get(bay.id) ?? []);
      let [busyMs, openMs] = [0, 0];
      const days = windows.map(({ day, open }) => {
        if (!open) return { day, share: null };
        const overlap = spans.reduce(
          (total, [a, b]) => total + Math.max(0, Math.min(b, open.to) - Math.max(a, open.from)),
          0,
        );
        busyMs += overlap;
        openMs += open.to - open.from;
        return { day, share: ratio(overlap / (open.to - open.from)) };
      });
      return { bayId: bay.id, name: bay.name, days, week: openMs > 0 ? ratio(busyMs / openMs) : null };
    });
  }
}

/**
 * The calendar helpers of `shared` work through time-zone-aware dates and take up to 2 ms a call; their
 * answers for a week never change, and a report asks for the same weeks again and again.
 */
const calendar = new Map<string, unknown>();
function remember<T>(key: string, compute: () => T): T {
  if (calendar.size > 10_000) calendar.clear();
  if (!calendar.has(key)) calendar.set(key, compute());
  return calendar.get(key) as T;
}
const zoneKey = (settings: ShopSettings) =>
  `${settings.timeZone}|${settings.workweekStartDay}|${settings.workweekStartHour}`;
const boundsOf = (label: string, settings: ShopSettings): TimeRange =>
  remember(`bounds|${label}|${zoneKey(settings)}`, () => workweekBounds(label, settings));
const daysOf = (label: string, settings: ShopSettings): ShopDay[] =>
  remember(`days|${label}|${zoneKey(settings)}`, () => workweekDays(label, settings));

function getOrAdd<K, V>(map: Map<K, Map<number, V>>, key: K): Map<number, V> {
  let inner = map.get(key);
  if (!inner) map.set(key, (inner = new Map()));
  return inner;
}

function technicianIdsOf(week: WeekFigures): number[] {
  return [...new Set([...week.technicians.keys(), ...week.flagged.keys()])];
}

/** A technician's week in hours, unrounded. */
function hoursOf(week: WeekFigures, technicianId: number): LabourHours {
  const totals = week.technicians.get(technicianId)?.totals;
  const flagged = [...(week.flagged.get(technicianId)?.values() ?? [])].reduce((sum, h) => sum + h, 0);
  return {
    attendanceHours: (totals?.attendanceSeconds ?? 0) / HOUR_S,
    clockedHours: (totals?.clockedSeconds ?? 0) / HOUR_S,
    flaggedHours: flagged,
  };
}

/** The day's opening hours in the shop's time zone, cut at `now`; null when closed or not open yet. */
function openWindow(day: ShopDay, settings: ShopSettings, now: Date): { from: number; to: number } | null {
  const weekday = new Date(`${day.day}T12:00:00Z`).getUTCDay();
  const hoursOpen = settings.openingHours[weekday];
  if (!hoursOpen) return null;
  const from = shopLocalInstant(day.day, hoursOpen.open, settings.timeZone).getTime();
  const to = Math.min(shopLocalInstant(day.day, hoursOpen.close, settings.timeZone).getTime(), now.getTime());
  return to > from ? { from, to } : null;
}

/** Opening hours of the week already past at `now`, and in all. */
function openingProgress(
  days: readonly ShopDay[],
  settings: ShopSettings,
  now: Date,
): { elapsedMs: number; totalMs: number } {
  const far = new Date(8.64e15);
  let [elapsedMs, totalMs] = [0, 0];
  for (const day of days) {
    const all = openWindow(day, settings, far);
    const past = openWindow(day, settings, now);
    totalMs += all ? all.to - all.from : 0;
    elapsedMs += past ? past.to - past.from : 0;
  }
  return { elapsedMs, totalMs };
}

/** Union of intervals, sorted. */
function merge(spans: [number, number][]): [number, number][] {
  const sorted = [...spans].sort((a, b) => a[0] - b[0]);
  const out: [number, number][] = [];
  for (const [a, b] of sorted) {
    const last = out.at(-1);
    if (last && a <= last[1]) last[1] = Math.max(last[1], b);
    else out.push([a, b]);
  }
  return out;
}
