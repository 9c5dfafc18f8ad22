import {
  BadRequestException,
  Inject,
  Injectable,
  Logger,
  type OnApplicationBootstrap,
  type OnApplicationShutdown,
  type StreamableFile,
} from '@nestjs/common';
import { and, asc, eq, gte, isNotNull, lt, ne, sql, type SQL } from 'drizzle-orm';
import {
  addIsoWeeks,
  EFFICIENCY_NOTE,
  hoursOf,
  KPI_FORMULAS,
  KPI_GUIDELINES,
  KPI_NAMES_NOTE,
  LABOUR_TREND_WEEKS,
  labourHoursOf,
  labourKpis,
  PAY_ESTIMATE_CAUTION,
  secondsOf,
  shopLabourSeconds,
  wholeSeconds,
  workweekName,
  workweekOf,
  type BayUtilisation,
  type ExceptionList,
  type LabourReport,
  type LabourLineTotals,
  type LabourReportLine,
  type LabourReportRow,
  type LabourReportTechnician,
  type LabourSeconds,
  type PayReport,
  type ReportQuery,
  type ReviewExceptionBody,
  type Role,
  type ShopSettings,
  type WeekSummary,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { keepServing } from '../common/keep-serving.js';
import { DB, type Db } from '../db/database.js';
import { lineIsDone } from '../db/line-is-done.js';
import { bays, heldPunches, jobLines, punches, repairOrders } from '../db/schema/index.js';
import { ClosedWeeksService } from '../payroll/closed-weeks.service.js';
import { ExceptionsService } from '../payroll/exceptions.service.js';
import { ShopService } from '../shop/shop.service.js';
import { openWindow } from './opening-hours.js';
import { PaySummaryService } from './pay-summary.service.js';
import { reportPeople } from './report-people.js';
import { labourCsv, payCsv } from './reports.csv.js';
import {
  daysOf,
  firstJobOn,
  HOUR_S,
  inIds,
  labourSecondsOf,
  remember,
  shopSecondsOf,
  WeekFiguresService,
  type WeekFigures,
} from './week-figures.service.js';

const roundTo = (value: number, places: number) => Math.round(value * 10 ** places) / 10 ** places;
const hours = (value: number) => roundTo(value, 4);
const ratio = (value: number | null) => (value === null ? null : roundTo(value, 6));

/** A row as shown: each hour figure rounded once from its whole seconds (as the pay summary's are). */
function present(seconds: LabourSeconds): LabourReportRow {
  const row = labourKpis(labourHoursOf(seconds));
  return {
    attendanceHours: hoursOf(seconds.attendanceSeconds),
    clockedHours: hoursOf(seconds.clockedSeconds),
    flaggedHours: hoursOf(seconds.flaggedSeconds),
    matchedClockedHours: hoursOf(seconds.matchedClockedSeconds),
    workInProgressHours: hoursOf(seconds.workInProgressSeconds),
    productivity: ratio(row.productivity),
    efficiency: ratio(row.efficiency),
    proficiency: ratio(row.proficiency),
  };
}

/** The labour trend's weeks, oldest first, ending with `label`. */
const trendWeeks = (label: string): string[] =>
  Array.from({ length: LABOUR_TREND_WEEKS }, (_, i) =>
    remember(`add|${label}|${i}`, () => addIsoWeeks(label, i + 1 - LABOUR_TREND_WEEKS)),
  );

/**
 * How long after a start the running week's trend is counted: once the screens reconnected and took their
 * snapshots, so that the thousand sockets of a restart never wait behind it.
 */
const TREND_KEPT_AFTER_START_MS = 3_000;

/** The weekly labour report, the pay summary, a technician's week and the exceptions list. */
@Injectable()
export class ReportsService implements OnApplicationBootstrap, OnApplicationShutdown {
  private readonly logger = new Logger(ReportsService.name);
  private trendKeeping: NodeJS.Timeout | null = null;
  private stopped = false;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
    private readonly weeks: WeekFiguresService,
    private readonly paySummary: PaySummaryService,
    private readonly exceptionsService: ExceptionsService,
    private readonly closedWeeks: ClosedWeeksService,
  ) {}

  /**
   * The first labour report after a start would count the trend's weeks of punches (about half a second on
   * years of them): they are counted a little after the start, in turns, before anyone asks.
   */
  onApplicationBootstrap(): void {
    this.trendKeeping = setTimeout(
      () => keepServing(this.logger, 'Counting the labour trend', () => this.keepRunningTrend()),
      TREND_KEPT_AFTER_START_MS,
    ).unref();
  }

  onApplicationShutdown(): void {
    this.stopped = true;
    if (this.trendKeeping) clearTimeout(this.trendKeeping);
  }

  private async keepRunningTrend(): Promise<void> {
    const now = new Date();
    const settings = this.shop.settings(now);
    const labels = trendWeeks(workweekOf(now, settings)).slice(0, -1);
    await this.weeks.keepShopSecondsInTurns(labels, settings, now, () => this.stopped);
  }

  /**
   * The trend's past weeks that are not kept are counted first, one a turn of the event loop: after a start
   * or a late punch they are weeks of punches, and the punches arriving meanwhile are answered between them.
   */
  async labourAnswer(
    { week, format }: ReportQuery,
    now = new Date(),
  ): Promise<LabourReport | StreamableFile> {
    const settings = this.shop.settings(now);
    const label = week ?? workweekOf(now, settings);
    await this.weeks.keepShopSecondsInTurns(trendWeeks(label).slice(0, -1), settings, now);
    const report = this.labour(label, now);
    return format === 'csv' ? labourCsv(report) : report;
  }

  payAnswer({ week, format }: ReportQuery): PayReport | StreamableFile {
    const report = this.pay(week);
    return format === 'csv' ? payCsv(report) : report;
  }

  /** The pay summary of the shop workweek that starts in ISO week `week` (default: the one running now). */
  pay(week?: string, now = new Date()): PayReport {
    return this.paySummary.pay(week, now);
  }

  /**
   * One technician's week as the reports count it: the labour row and the very pay-summary row (so the
   * office, the CSV and the kiosk agree). Pay goes to the owner, and to the technician unless the shop hides
   * it on the kiosk; never to the foreman, who does not read the pay summary either.
   */
  technicianWeek(week: string, technicianId: number, viewer: Role, now = new Date()): WeekSummary {
    const settings = this.shop.settings(now);
    const figures = this.weeks.figuresOf(week, technicianId, settings, now);
    const showPay = viewer === 'owner' || (viewer === 'technician' && settings.kioskShowsPay);
    return {
      labour: present(labourSecondsOf(figures, technicianId)),
      pay: showPay ? this.paySummary.technicianRow(week, technicianId, now) : null,
      closed: this.closedWeeks.closed(week) !== undefined,
      caution: PAY_ESTIMATE_CAUTION,
    };
  }

  /** Every exception of the week, shop-wide, for the foreman. */
  exceptions(week?: string, now = new Date()): ExceptionList {
    const settings = this.shop.settings(now);
    const label = week ?? workweekOf(now, settings);
    const current = this.weeks.figures([label], settings, now)[0]!;
    const exceptions = this.exceptionsService.collect({
      from: current.from,
      to: current.to,
      now,
      ledgers: new Map([...current.technicians].map(([id, own]) => [id, own.ledger])),
    });
    return {
      week: label,
      from: current.from.toISOString(),
      to: current.to.toISOString(),
      timeZone: settings.timeZone,
      exceptions,
      unresolved: exceptions.filter((e) => e.resolution === null).length,
    };
  }

  /** The foreman marks a timecard exception reviewed; it must be one the week shows for that punch. */
  reviewException(body: ReviewExceptionBody, actor: Principal, now = new Date()): ExceptionList {
    const punchId = body.key.split(':')[1] ?? '';
    const punch =
      this.db.select().from(punches).where(eq(punches.id, punchId)).get() ??
      this.db.select().from(heldPunches).where(eq(heldPunches.id, punchId)).get();
    if (!punch) throw new BadRequestException('No exception with that key');
    const week = workweekOf(punch.at, this.shop.settings(now));
    const found = this.exceptions(week, now).exceptions.find((e) => e.key === body.key);
    if (!found) throw new BadRequestException('No exception with that key');
    this.exceptionsService.review(body, found.technicianId, actor, now);
    return this.exceptions(week, now);
  }

  /** The labour report of the shop workweek that starts in ISO week `week` (default: the one running now). */
  labour(week?: string, now = new Date()): LabourReport {
    const settings = this.shop.settings(now);
    const label = week ?? workweekOf(now, settings);
    const labels = trendWeeks(label);
    const current = this.weeks.figures([label], settings, now)[0]!;
    const trend = [...this.weeks.shopSeconds(labels.slice(0, -1), settings, now), shopSecondsOf(current)];
    const people = reportPeople(this.db, current);
    const lineIds = new Set<number>();
    for (const { totals } of current.technicians.values())
      for (const [id, seconds] of Object.entries(totals.jobSeconds)) if (seconds > 0) lineIds.add(Number(id));
    for (const lines of current.flagged.values()) for (const id of lines.keys()) lineIds.add(id);
    const lineInfo = this.lineInfo([...lineIds]);

    const rows = people.map((person) => ({ person, seconds: labourSecondsOf(current, person.id) }));
    const technicians: LabourReportTechnician[] = rows.map(({ person, seconds: row }) => {
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
            clockedHours: hoursOf(wholeSeconds(jobSeconds[id] ?? 0)),
            overUnderHours: share === undefined ? null : hours(share - toDate / HOUR_S),
          };
        });
      const lineTotals: LabourLineTotals = {
        bookHours: hoursOf(lines.reduce((sum, line) => sum + secondsOf(line.bookHours), 0)),
        flaggedHours: hoursOf(row.flaggedSeconds),
        clockedHours: hoursOf(wholeSeconds([...ids].reduce((sum, id) => sum + (jobSeconds[id] ?? 0), 0))),
      };
      return { technicianId: person.id, name: person.name, ...present(row), lines, lineTotals };
    });

    return {
      week: label,
      weekName: workweekName(label, settings),
      from: current.from.toISOString(),
      to: current.to.toISOString(),
      timeZone: settings.timeZone,
      technicians,
      shop: present(shopLabourSeconds(rows.map((row) => row.seconds))),
      formulas: KPI_FORMULAS,
      guidelines: KPI_GUIDELINES,
      namesNote: KPI_NAMES_NOTE,
      efficiencyNote: EFFICIENCY_NOTE,
      trend: labels.map((week, i) => ({
        week,
        weekName: workweekName(week, settings),
        ...present(trend[i]!),
      })),
      bayUtilisation: this.bayUtilisation(label, current, settings, now),
    };
  }

  private lineInfo(ids: number[]): Map<number, { title: string; bookHours: number; number: string }> {
    const rows = this.db
      .select({
        id: jobLines.id,
        title: jobLines.title,
        bookHours: jobLines.bookHours,
        number: repairOrders.number,
      })
      .from(jobLines)
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .where(inIds(jobLines.id, ids))
      .all();
    return new Map(rows.map((row) => [row.id, row]));
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
    // Two reads, each on its own index: the lines not done (a partial index), and those done since the
    // week began. A `+` keeps SQLite off the indexes of bays and of status, which hold nearly every line.
    const inBays = (which: SQL) =>
      this.db
        .select({
          bayId: jobLines.bayId,
          status: jobLines.status,
          queuedAt: jobLines.queuedAt,
          completedAt: jobLines.completedAt,
          // Qualified: a select from one table names its columns bare, which inside would mean the punch's id.
          firstOn: firstJobOn(sql`${jobLines}.id`),
        })
        .from(jobLines)
        .where(and(which, lt(jobLines.queuedAt, end)))
        .all();
    const lines = [
      ...inBays(and(ne(jobLines.status, 'done'), sql`+${jobLines.bayId} is not null`)!),
      ...inBays(and(lineIsDone, gte(jobLines.completedAt, week.from), isNotNull(jobLines.bayId))!),
    ];
    const busy = new Map<number, [number, number][]>();
    for (const line of lines) {
      const start = line.firstOn ?? line.queuedAt.getTime();
      const stop = Math.min(
        line.status === 'done' && line.completedAt ? line.completedAt.getTime() : now.getTime(),
        now.getTime(),
      );
      if (stop <= start) continue;
      const spans = busy.get(line.bayId!);
      if (spans) spans.push([start, stop]);
      else busy.set(line.bayId!, [[start, stop]]);
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
