import { Inject, Injectable } from '@nestjs/common';
import { and, eq, gte, inArray, lt, or } from 'drizzle-orm';
import {
  addIsoWeeks,
  additionalOvertimeCents,
  applicableMinimumWageCents,
  estimateWeeklyPay,
  hoursOf as hoursFromSeconds,
  MONEY_ROUNDING_RULE,
  NEAR_OVERTIME_HOURS,
  PAY_ESTIMATE_CAUTION,
  payableBelowMinimumWageCaution,
  roundHalfUp,
  secondsOf,
  wholeSeconds,
  wholeSecondsOfParts,
  workweekName,
  workweekOf,
  type AdditionalOvertime,
  type DatedPayRate,
  type DatedPayRules,
  type PayAdjustment,
  type PayDay,
  type PayEstimate,
  type PayReport,
  type PayReportTechnician,
  type PayReportTotals,
  type ShopSettings,
  type TimeException,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { jobLines, users } from '../db/schema/index.js';
import { ClosedWeeksService, type PayWeekRow } from '../payroll/closed-weeks.service.js';
import { ExceptionsService } from '../payroll/exceptions.service.js';
import { PayRatesService } from '../payroll/pay-rates.service.js';
import { ShopService } from '../shop/shop.service.js';
import { openingProgress } from './opening-hours.js';
import { reportPeople } from './report-people.js';
import {
  boundsOf,
  daysOf,
  labourSecondsOf,
  WeekFiguresService,
  type TechnicianWeek,
  type WeekFigures,
} from './week-figures.service.js';

/** Project a running week's hours only once a working day of opening hours has passed. */
const PROJECTION_MIN_OPEN_MS = 8 * 3600_000;
/** Lines clocked longer ago than this before the week they were finished in get no additional overtime. */
const SPANNING_WEEKS_LIMIT = 52;
/** Closed weeks looked back through for changes made after closing. */
const CLOSED_RUN_LIMIT = 520;

interface Technician {
  id: number;
  name: string;
}

/** A technician's pay for one week, before the report's rounding of hours. */
interface TechnicianPay {
  person: Technician;
  rate: DatedPayRate;
  estimate: PayEstimate;
  additionalOvertime: AdditionalOvertime[];
}

/** A week's live pay, with the lines it flagged (kept with a closed week's snapshot). */
export interface LivePay {
  report: PayReport;
  lineIds: number[];
}

/**
 * The pay summary of a workweek, from the same figures as the labour report: rates and rules in force when
 * the week began, exceptions, overtime for flat-rate pay earned over several weeks, and the adjustments owed
 * for closed weeks that changed after closing. A closed week answers from what was saved when it closed.
 */
@Injectable()
export class PaySummaryService {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly shop: ShopService,
    private readonly weeks: WeekFiguresService,
    private readonly rates: PayRatesService,
    private readonly closedWeeks: ClosedWeeksService,
    private readonly exceptions: ExceptionsService,
  ) {}

  /** The pay summary of the shop workweek that starts in ISO week `week` (default: the one running now). */
  pay(week?: string, now = new Date()): PayReport {
    const settings = this.shop.settings(now);
    const label = week ?? workweekOf(now, settings);
    const closed = this.closedWeeks.closed(label);
    if (closed?.snapshot) return this.fromSnapshot(closed);
    const firstClosedAt = this.closedWeeks.firstClosedAt(label);
    return { ...this.live(label, settings, now).report, firstClosedAt: firstClosedAt?.toISOString() ?? null };
  }

  /**
   * One technician's row of the pay summary (a timecard, the kiosk's week), worked out for that technician
   * alone: the very row the whole summary shows.
   */
  technicianRow(week: string, technicianId: number, now = new Date()): PayReportTechnician | null {
    const settings = this.shop.settings(now);
    const closed = this.closedWeeks.closed(week);
    const rows = closed?.snapshot
      ? this.fromSnapshot(closed).technicians
      : this.liveRows(week, settings, now, { withAdjustments: true, only: technicianId }).technicians;
    return rows.find((row) => row.technicianId === technicianId) ?? null;
  }

  /** The week computed now from the records, whatever its state. */
  live(label: string, settings: ShopSettings, now: Date, { withAdjustments = true } = {}): LivePay {
    const live = this.liveRows(label, settings, now, { withAdjustments });
    const { current, rules, pays, technicians, adjustments, exceptions } = live;
    const report: PayReport = {
      week: label,
      weekName: workweekName(label, settings),
      from: current.from.toISOString(),
      to: current.to.toISOString(),
      timeZone: settings.timeZone,
      rules: rules.overtimeRules,
      minimumWageCents: applicableMinimumWageCents(rules),
      payRules: rules,
      caution: PAY_ESTIMATE_CAUTION,
      rounding: MONEY_ROUNDING_RULE,
      apportionSpanningLines: settings.apportionSpanningLines,
      closed: false,
      closedAt: null,
      closedBy: null,
      firstClosedAt: null,
      technicians,
      totals: totalsOf(technicians, pays),
      adjustments,
      unresolvedExceptions: exceptions.filter((e) => e.resolution === null).length,
    };
    return {
      report,
      lineIds: [...new Set([...current.flagged.values()].flatMap((lines) => [...lines.keys()]))],
    };
  }

  /** The rows of a week computed now; with `only`, that technician's alone, from their own figures. */
  private liveRows(
    label: string,
    settings: ShopSettings,
    now: Date,
    { withAdjustments, only }: { withAdjustments: boolean; only?: number },
  ) {
    const current =
      only === undefined
        ? this.weeks.figures([label], settings, now)[0]!
        : this.weeks.figuresOf(label, only, settings, now);
    const days = daysOf(label, settings);
    const firstDay = days[0]!.day;
    const rules = this.shop.rulesFor(firstDay);
    const counted = (technicianId: number) => only === undefined || technicianId === only;
    const adjustments = withAdjustments
      ? this.adjustments(label, settings, now).filter((a) => counted(a.technicianId))
      : [];
    const people = reportPeople(this.db, current, new Set(adjustments.map((a) => a.technicianId))).filter(
      (person) => counted(person.id),
    );
    const rates = this.rates.ratesOn(
      people.map((p) => p.id),
      firstDay,
    );
    const spanning = settings.apportionSpanningLines
      ? this.spanningShares(current, settings, now)
      : new Map<number, SpanningShare>();
    const pays: TechnicianPay[] = people.map((person) => {
      const rate = rates.get(person.id)!;
      const share = spanning.get(person.id);
      const estimate = estimateWeeklyPay({
        ...this.payInput(current, person.id, settings),
        rate,
        rules,
        earlierWeeksFlaggedSeconds: rate.payType === 'hourly' ? 0 : (share?.earlierFlaggedSeconds ?? 0),
      });
      const additionalOvertime =
        rate.payType === 'hourly' || !share
          ? []
          : share.byWeek
              .map(({ week, flaggedHours, earlier }) => ({
                forWeek: week,
                forWeekName: workweekName(week, settings),
                cents: additionalOvertimeCents(roundHalfUp(flaggedHours * rate.flatRateCents), earlier),
              }))
              .filter((extra) => extra.cents > 0);
      return { person, rate, estimate, additionalOvertime };
    });

    const exceptions = this.exceptions.collect({
      from: current.from,
      to: current.to,
      now,
      ledgers: new Map(
        [...current.technicians].filter(([id]) => counted(id)).map(([id, week]) => [id, week.ledger]),
      ),
    });
    const running = now >= current.from && now < current.to;
    const { elapsedMs, totalMs } = openingProgress(days, settings, now);
    const technicians = pays.map((pay) =>
      this.row(pay, current, rules, {
        running,
        projectFactor: elapsedMs >= PROJECTION_MIN_OPEN_MS ? totalMs / elapsedMs : 0,
        exceptions: exceptions.filter((e) => e.technicianId === pay.person.id),
        adjustments: adjustments.filter((a) => a.technicianId === pay.person.id),
      }),
    );
    return { current, rules, pays, technicians, adjustments, exceptions };
  }

  /**
   * The figures the pay rules need from a technician's week, in whole seconds: the labour report's own
   * (`labourSecondsOf`), so hours worked there and attendance here are one figure. The days are rounded at
   * their running totals, so they add up to the week.
   */
  private payInput(week: WeekFigures, technicianId: number, settings: ShopSettings) {
    const own: TechnicianWeek | undefined = week.technicians.get(technicianId);
    const labour = labourSecondsOf(week, technicianId);
    const days = daysOf(week.week, settings);
    const within = days.map((day) => own?.ledger.within(day.from, day.to));
    const worked = wholeSecondsOfParts(within.map((totals) => totals?.attendanceSeconds ?? 0));
    const rest = wholeSecondsOfParts(within.map((totals) => totals?.restBreakSeconds ?? 0));
    const payDays: PayDay[] = days.map((day, i) => ({
      workedSeconds: worked[i]!,
      restSeconds: rest[i]!,
      meals: own
        ? own.ledger.breaks
            .filter((b) => b.kind === 'meal' && b.from >= day.from && b.from < day.to)
            .map((meal) => ({
              afterWorkedSeconds: wholeSeconds(own.ledger.within(day.from, meal.from).attendanceSeconds),
              seconds: wholeSeconds((meal.to.getTime() - meal.from.getTime()) / 1000),
            }))
        : [],
    }));
    return {
      flaggedSeconds: labour.flaggedSeconds,
      workedSeconds: labour.attendanceSeconds,
      productiveSeconds: labour.clockedSeconds,
      restSeconds: wholeSeconds(own?.totals.restBreakSeconds ?? 0),
      days: payDays,
    };
  }

  private row(
    { person, rate, estimate, additionalOvertime }: TechnicianPay,
    week: WeekFigures,
    rules: DatedPayRules,
    context: {
      running: boolean;
      projectFactor: number;
      exceptions: TimeException[];
      adjustments: PayAdjustment[];
    },
  ): PayReportTechnician {
    const hoursWorked = hoursFromSeconds(estimate.workedSeconds);
    // 29 USC 213(b)(10)(A) exempts from federal overtime only; California's daily overtime still applies.
    const overtimeApplies = rules.overtimeRules === 'california' || !rate.overtimeExempt;
    const additionalOvertimeCents = additionalOvertime.reduce((sum, extra) => sum + extra.cents, 0);
    const adjustmentCents = context.adjustments.reduce((sum, adjustment) => sum + adjustment.cents, 0);
    const payableCents = estimate.totalCents + additionalOvertimeCents + adjustmentCents;
    return {
      technicianId: person.id,
      name: person.name,
      payType: rate.payType,
      flatRateCents: rate.flatRateCents,
      hourlyRateCents: rate.hourlyRateCents,
      guaranteeCents: rate.guaranteeCents,
      overtimeExempt: rate.overtimeExempt,
      rateFrom: rate.effectiveFrom,
      flaggedHours: hoursFromSeconds(estimate.flaggedSeconds),
      flaggedPayCents: estimate.flaggedPayCents,
      guaranteeTopUpCents: estimate.guaranteeTopUpCents,
      hourlyPayCents: estimate.hourlyPayCents,
      restHours: hoursFromSeconds(estimate.restSeconds),
      restRateCents: estimate.restRateCents,
      restPayCents: estimate.restPayCents,
      otherNonProductiveHours: hoursFromSeconds(estimate.otherNonProductiveSeconds),
      otherNonProductivePayCents: estimate.otherNonProductivePayCents,
      nonProductivePayCents: estimate.nonProductivePayCents,
      straightTimeCents: estimate.straightTimeCents,
      hoursWorked,
      regularRateCents: estimate.regularRateCents,
      overtimeHours: hoursFromSeconds(estimate.overtimeSeconds),
      doubleTimeHours: hoursFromSeconds(estimate.doubleTimeSeconds),
      overtimePremiumCents: estimate.overtimePremiumCents,
      minimumWageTopUpCents: estimate.minimumWageTopUpCents,
      mealPremiumDays: estimate.mealPremiumDays,
      mealPremiumCents: estimate.mealPremiumCents,
      totalCents: estimate.totalCents,
      additionalOvertime,
      additionalOvertimeCents,
      adjustments: context.adjustments,
      adjustmentCents,
      payableCents,
      underMinimumWage: estimate.minimumWageTopUpCents > 0,
      payableCaution: payableBelowMinimumWageCaution(
        { payableCents, adjustmentCents, workedSeconds: estimate.workedSeconds },
        estimate.minimumWageCents,
      ),
      nearOvertime:
        context.running &&
        overtimeApplies &&
        Math.max(hoursWorked, hoursWorked * context.projectFactor) >= NEAR_OVERTIME_HOURS,
      exceptions: context.exceptions,
      unresolvedExceptions: context.exceptions.filter((e) => e.resolution === null).length,
    };
  }

  /**
   * 29 CFR 778.119–778.120 by analogy: for each line finished this week that was also clocked in earlier
   * weeks, the part of its flagged time clocked earlier (left out of this week's regular rate), and per
   * earlier week the flagged hours allocated to it with that week's figures (for the additional overtime).
   */
  private spanningShares(
    current: WeekFigures,
    settings: ShopSettings,
    now: Date,
  ): Map<number, SpanningShare> {
    const spanning: {
      technicianId: number;
      lineId: number;
      flaggedHours: number;
      toDate: number;
      earlier: number;
    }[] = [];
    for (const [technicianId, lines] of current.flagged)
      for (const [lineId, flaggedHours] of lines) {
        const toDate = current.clockedToDate.get(lineId)?.get(technicianId) ?? 0;
        const inWeek = current.technicians.get(technicianId)?.totals.jobSeconds[lineId] ?? 0;
        if (toDate - inWeek >= 1)
          spanning.push({ technicianId, lineId, flaggedHours, toDate, earlier: toDate - inWeek });
      }
    const result = new Map<number, SpanningShare>();
    if (spanning.length === 0) return result;
    const firsts = this.weeks.firstClockedOn(spanning.map((s) => s.lineId));
    const earliest = Math.min(...[...firsts.values()].map((at) => at.getTime()));
    let label = workweekOf(new Date(earliest), settings);
    const limit = addIsoWeeks(current.week, -SPANNING_WEEKS_LIMIT);
    if (label < limit) label = limit;
    const labels: string[] = [];
    for (; label < current.week; label = addIsoWeeks(label, 1)) labels.push(label);
    const earlierWeeks = labels.length ? this.weeks.figures(labels, settings, now, true) : [];

    for (const span of spanning) {
      const share = result.get(span.technicianId) ?? {
        earlierFlaggedSeconds: 0,
        byWeek: [],
        earlierHours: 0,
      };
      share.earlierHours += (span.flaggedHours * span.earlier) / span.toDate;
      for (const week of earlierWeeks) {
        const seconds = week.technicians.get(span.technicianId)?.totals.jobSeconds[span.lineId] ?? 0;
        if (seconds <= 0) continue;
        let entry = share.byWeek.find((e) => e.week === week.week);
        if (!entry) {
          entry = {
            week: week.week,
            flaggedHours: 0,
            earlier: this.earlierWeek(week, span.technicianId, settings),
          };
          share.byWeek.push(entry);
        }
        entry.flaggedHours += (span.flaggedHours * seconds) / span.toDate;
      }
      share.earlierFlaggedSeconds = secondsOf(share.earlierHours);
      result.set(span.technicianId, share);
    }
    for (const share of result.values()) share.byWeek.sort((a, b) => a.week.localeCompare(b.week));
    return result;
  }

  /** An earlier week's hours worked and overtime for a technician, with the rules and rate of that week. */
  private earlierWeek(week: WeekFigures, technicianId: number, settings: ShopSettings) {
    const firstDay = daysOf(week.week, settings)[0]!.day;
    const estimate = estimateWeeklyPay({
      ...this.payInput(week, technicianId, settings),
      rate: this.rates.ratesOn([technicianId], firstDay).get(technicianId)!,
      rules: this.shop.rulesFor(firstDay),
    });
    return {
      workedSeconds: estimate.workedSeconds,
      timeAndHalfSeconds: estimate.timeAndHalfSeconds,
      doubleTimeSeconds: estimate.doubleTimeSeconds,
    };
  }

  /**
   * What closed weeks owe after changes made since they closed (a line finished, edited, reopened or signed
   * off later). Shown in the first open week after them: the closed weeks just before `label`. Each closed
   * week's difference is its live figures less its snapshot less what any closed week after it already
   * carried, also one beyond `label` (a week reopened while later ones stay closed).
   */
  private adjustments(label: string, settings: ShopSettings, now: Date): PayAdjustment[] {
    const run: PayWeekRow[] = [];
    for (let week = addIsoWeeks(label, -1), i = 0; i < CLOSED_RUN_LIMIT; week = addIsoWeeks(week, -1), i++) {
      const closed = this.closedWeeks.closed(week);
      if (!closed?.snapshot) break;
      run.unshift(closed);
    }
    const result: PayAdjustment[] = [];
    const closedLater = (closed: PayWeekRow) =>
      this.closedWeeks
        .labels()
        .filter((week) => week > closed.week)
        .map((week) => this.closedWeeks.closed(week)!)
        .filter((later) => later.snapshot && paidAtOf(later) > paidAtOf(closed));
    for (const closed of run) {
      if (!this.changedSinceClosing(closed, settings)) continue;
      const live = this.live(closed.week, settings, now, { withAdjustments: false }).report;
      const snapshot = closed.snapshot!.report;
      const carried = closedLater(closed).flatMap((later) =>
        later.snapshot!.report.adjustments.filter((a) => a.forWeek === closed.week),
      );
      const ids = new Set([...live.technicians, ...snapshot.technicians].map((row) => row.technicianId));
      for (const technicianId of ids) {
        const was = snapshot.technicians.find((row) => row.technicianId === technicianId);
        const is = live.technicians.find((row) => row.technicianId === technicianId);
        const paid = carried.filter((a) => a.technicianId === technicianId);
        const weekCents = (row?: PayReportTechnician) =>
          row ? row.totalCents + row.additionalOvertimeCents : 0;
        const cents = weekCents(is) - weekCents(was) - paid.reduce((sum, a) => sum + a.cents, 0);
        const flaggedHours =
          (is?.flaggedHours ?? 0) -
          (was?.flaggedHours ?? 0) -
          paid.reduce((sum, a) => sum + a.flaggedHours, 0);
        if (cents !== 0 || Math.abs(flaggedHours) >= 0.00005)
          result.push({
            technicianId,
            forWeek: closed.week,
            forWeekName: workweekName(closed.week, settings),
            flaggedHours: Math.round(flaggedHours * 10_000) / 10_000,
            cents,
          });
      }
    }
    return result;
  }

  /**
   * The week was reopened since its figures were saved (its punches may have changed), or a line it flagged,
   * or finished in it, was changed after.
   */
  private changedSinceClosing(closed: PayWeekRow, settings: ShopSettings): boolean {
    if (closed.reopenedAt) return true;
    const { from, to } = boundsOf(closed.week, settings);
    const lineIds = closed.snapshot!.lineIds;
    const touched = this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(
        and(
          gte(jobLines.updatedAt, paidAtOf(closed)),
          or(
            and(gte(jobLines.completedAt, from), lt(jobLines.completedAt, to)),
            lineIds.length ? inArray(jobLines.id, lineIds) : undefined,
          ),
        ),
      )
      .get();
    return touched !== undefined;
  }

  private fromSnapshot(closed: PayWeekRow): PayReport {
    const by = closed.closedBy
      ? this.db.select({ name: users.name }).from(users).where(eq(users.id, closed.closedBy)).get()?.name
      : undefined;
    const report = closed.snapshot!.report;
    return {
      ...report,
      // A week closed before the payable caution was added has none saved: it is worked out from its figures.
      technicians: report.technicians.map((row) =>
        row.payableCaution !== undefined
          ? row
          : {
              ...row,
              payableCaution: payableBelowMinimumWageCaution(
                { ...row, workedSeconds: secondsOf(row.hoursWorked) },
                report.minimumWageCents,
              ),
            },
      ),
      closed: true,
      closedAt: closed.closedAt!.toISOString(),
      firstClosedAt: closed.reopenedAt ? paidAtOf(closed).toISOString() : null,
      closedBy: by ?? null,
    };
  }
}

interface SpanningShare {
  /** Of the week's flagged time, the part clocked in earlier weeks, in whole seconds. */
  earlierFlaggedSeconds: number;
  earlierHours: number;
  byWeek: { week: string; flaggedHours: number; earlier: ReturnType<PaySummaryService['earlierWeek']> }[];
}

/** Money adds the rounded cents of the rows; hours add the rows' whole seconds and are rounded once. */
function totalsOf(rows: readonly PayReportTechnician[], pays: readonly TechnicianPay[]): PayReportTotals {
  const sum = (pick: (row: PayReportTechnician) => number) =>
    rows.reduce((total, row) => total + pick(row), 0);
  const hours = (pick: (estimate: PayEstimate) => number) =>
    hoursFromSeconds(pays.reduce((total, pay) => total + pick(pay.estimate), 0));
  return {
    flaggedHours: hours((e) => e.flaggedSeconds),
    hoursWorked: hours((e) => e.workedSeconds),
    overtimeHours: hours((e) => e.overtimeSeconds),
    doubleTimeHours: hours((e) => e.doubleTimeSeconds),
    restHours: hours((e) => e.restSeconds),
    otherNonProductiveHours: hours((e) => e.otherNonProductiveSeconds),
    flaggedPayCents: sum((row) => row.flaggedPayCents),
    guaranteeTopUpCents: sum((row) => row.guaranteeTopUpCents),
    hourlyPayCents: sum((row) => row.hourlyPayCents),
    restPayCents: sum((row) => row.restPayCents),
    otherNonProductivePayCents: sum((row) => row.otherNonProductivePayCents),
    nonProductivePayCents: sum((row) => row.nonProductivePayCents),
    straightTimeCents: sum((row) => row.straightTimeCents),
    overtimePremiumCents: sum((row) => row.overtimePremiumCents),
    minimumWageTopUpCents: sum((row) => row.minimumWageTopUpCents),
    mealPremiumCents: sum((row) => row.mealPremiumCents),
    totalCents: sum((row) => row.totalCents),
    additionalOvertimeCents: sum((row) => row.additionalOvertimeCents),
    adjustmentCents: sum((row) => row.adjustmentCents),
    payableCents: sum((row) => row.payableCents),
  };
}

/** When a closed week's saved figures were taken: its first close (rows from before it was kept: its close). */
const paidAtOf = (row: PayWeekRow): Date => row.paidAt ?? row.closedAt!;
