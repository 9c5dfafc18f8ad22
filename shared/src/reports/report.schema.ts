import { z } from 'zod';
import type { TimeException } from '../exceptions/exceptions.schema.js';
import { plainText } from '../input/fields.js';
import type { PayRate } from '../pay/pay-types.js';
import { OVERTIME_RULES, type DatedPayRules } from '../shop/shop.schema.js';
import { isoWeekSchema } from '../time/workweek.js';
import type { KpiName, LabourReportRow } from './kpis.js';

export const REPORT_FORMATS = ['json', 'csv'] as const;
export type ReportFormat = (typeof REPORT_FORMATS)[number];

/**
 * `GET /api/reports/labour` and `/pay`: `week=YYYY-Www` names the shop workweek that starts in that ISO week
 * (the same week when the shop's week starts on Monday at 00:00); default the one running now.
 */
export const reportQuerySchema = z.object({
  week: isoWeekSchema.optional(),
  format: z.enum(REPORT_FORMATS).optional(),
});
export type ReportQuery = z.infer<typeof reportQuerySchema>;

/** How many workweeks the labour trend shows, ending with the report's week. */
export const LABOUR_TREND_WEEKS = 12;

/** Hours worked from which a week in progress is flagged as nearing the 40-hour overtime line. */
export const NEAR_OVERTIME_HOURS = 36;

/** One job line a technician clocked on in the week or was flagged for. Hours are decimal hours. */
export interface LabourReportLine {
  jobLineId: number;
  repairOrderNumber: string;
  title: string;
  /** The line's book hours, whole. */
  bookHours: number;
  /** This technician's share of the book hours when the line was finished this week; else 0. */
  flaggedHours: number;
  /** This technician's time clocked on the line within the week. */
  clockedHours: number;
  /**
   * Flagged minus all the time this technician clocked on the line (earlier weeks too): positive when
   * the work beat the book time. Null while the line is not finished within the week.
   */
  overUnderHours: number | null;
}

/** A technician's lines added up in whole seconds, each rounded once: not the sum of the rounded lines. */
export interface LabourLineTotals {
  bookHours: number;
  flaggedHours: number;
  clockedHours: number;
}

export interface LabourReportTechnician extends LabourReportRow {
  technicianId: number;
  name: string;
  lines: LabourReportLine[];
  lineTotals: LabourLineTotals;
}

export interface LabourTrendWeek extends LabourReportRow {
  week: string;
  /** "Week of Sun, Nov 29". */
  weekName: string;
}

export interface BayUtilisationDay {
  /** Local calendar day, 'YYYY-MM-DD'. */
  day: string;
  /** Share (0–1) of the day's opening hours the bay was not free; null when closed or not yet open. */
  share: number | null;
}

export interface BayUtilisation {
  bayId: number;
  name: string;
  days: BayUtilisationDay[];
  /** Over all the week's opening hours so far; null when the shop has not been open. */
  week: number | null;
}

export interface LabourReport {
  week: string;
  /** "Week of Sun, Nov 29": the shop workweek by its first day. */
  weekName: string;
  /** Start and end (exclusive) of the shop workweek, ISO 8601. */
  from: string;
  to: string;
  timeZone: string;
  technicians: LabourReportTechnician[];
  /** Hours summed over the technicians, then the ratios (never an average of ratios). */
  shop: LabourReportRow;
  formulas: Record<KpiName, string>;
  guidelines: Record<KpiName, { low: number; high: number }>;
  /** Trade sources disagree on the names: read the formulas. */
  namesNote: string;
  /** Why efficiency is on a matched basis, and what work in progress means. */
  efficiencyNote: string;
  /** The shop over the LABOUR_TREND_WEEKS workweeks ending with this one, oldest first. */
  trend: LabourTrendWeek[];
  bayUtilisation: BayUtilisation[];
}

/** A closed week's figures changed after it was closed: the difference is paid in the first open week. */
export interface PayAdjustment {
  technicianId: number;
  /** The closed week the difference belongs to. */
  forWeek: string;
  forWeekName: string;
  flaggedHours: number;
  cents: number;
}

/** 29 CFR 778.119 by analogy: overtime owed for an earlier week on flat-rate pay finished this week. */
export interface AdditionalOvertime {
  forWeek: string;
  forWeekName: string;
  cents: number;
}

export interface PayReportTechnician extends PayRate {
  technicianId: number;
  name: string;
  /** The day the rates shown took effect. */
  rateFrom: string;
  flaggedHours: number;
  flaggedPayCents: number;
  /** 29 CFR 778.111(b): what the hourly guarantee adds to the flat-rate pay. */
  guaranteeTopUpCents: number;
  /** Hourly pay type: every hour worked × the hourly rate. */
  hourlyPayCents: number;
  /** Wage-statement figures (California Labor Code 226.2): rest periods and other non-productive time. */
  restHours: number;
  restRateCents: number | null;
  restPayCents: number;
  otherNonProductiveHours: number;
  otherNonProductivePayCents: number;
  /** Rest pay plus other non-productive pay. */
  nonProductivePayCents: number;
  straightTimeCents: number;
  /** Attendance hours: shift time less bona fide meal breaks, paid rest breaks included. */
  hoursWorked: number;
  regularRateCents: number;
  /** Hours paid a premium: time-and-a-half and double-time together. */
  overtimeHours: number;
  doubleTimeHours: number;
  overtimePremiumCents: number;
  minimumWageTopUpCents: number;
  /** California Labor Code 226.7: estimated meal premiums, one hour at the regular rate per workday. */
  mealPremiumDays: number;
  mealPremiumCents: number;
  /** This week's own pay. */
  totalCents: number;
  additionalOvertime: AdditionalOvertime[];
  additionalOvertimeCents: number;
  adjustments: PayAdjustment[];
  adjustmentCents: number;
  /** Paid this week: its own pay, additional overtime for earlier weeks and adjustments for closed weeks. */
  payableCents: number;
  /** Flat-rate and non-productive pay fell short of the minimum wage for all hours worked. */
  underMinimumWage: boolean;
  /**
   * Set when payable this week is below the minimum wage × hours worked (an adjustment for a closed week took
   * it there): the caution in words, for payroll to confirm. Null otherwise. The pay math is not changed.
   */
  payableCaution: string | null;
  /**
   * The week is still running and overtime applies to this technician, with NEAR_OVERTIME_HOURS or more
   * worked so far or projected for the week at the pace so far over the shop's opening hours.
   */
  nearOvertime: boolean;
  exceptions: TimeException[];
  unresolvedExceptions: number;
}

export interface PayReportTotals {
  flaggedHours: number;
  hoursWorked: number;
  overtimeHours: number;
  doubleTimeHours: number;
  restHours: number;
  otherNonProductiveHours: number;
  flaggedPayCents: number;
  guaranteeTopUpCents: number;
  hourlyPayCents: number;
  restPayCents: number;
  otherNonProductivePayCents: number;
  nonProductivePayCents: number;
  straightTimeCents: number;
  overtimePremiumCents: number;
  minimumWageTopUpCents: number;
  mealPremiumCents: number;
  totalCents: number;
  additionalOvertimeCents: number;
  adjustmentCents: number;
  payableCents: number;
}

export interface PayReport {
  week: string;
  weekName: string;
  from: string;
  to: string;
  timeZone: string;
  /** The overtime rules in force when the week began. */
  rules: (typeof OVERTIME_RULES)[number];
  /** The highest of the federal, state and local minimum wages in force when the week began. */
  minimumWageCents: number;
  payRules: DatedPayRules;
  /** PAY_ESTIMATE_CAUTION: the figures are an estimate. */
  caution: string;
  /** MONEY_ROUNDING_RULE. */
  rounding: string;
  /** Whether 29 CFR 778.119 apportioning of lines spanning weeks is on, and what it means. */
  apportionSpanningLines: boolean;
  /** Closed pay weeks answer from the figures saved when they were closed. */
  closed: boolean;
  closedAt: string | null;
  closedBy: string | null;
  /**
   * Set once the week was reopened: when it was first closed. Its figures of then are what payroll was given;
   * closed again, the week keeps them and any difference is carried to the next open week.
   */
  firstClosedAt: string | null;
  technicians: PayReportTechnician[];
  totals: PayReportTotals;
  /** Every adjustment paid this week, for closed weeks that changed after closing. */
  adjustments: PayAdjustment[];
  /** Exceptions not yet dealt with: the week's figures are not final while this is above 0. */
  unresolvedExceptions: number;
}

/** A technician's week in one place: the same figures as the labour report and the pay summary. */
export interface WeekSummary {
  labour: LabourReportRow;
  /** Null when the kiosk is asked and the shop hides pay there. */
  pay: PayReportTechnician | null;
  closed: boolean;
  caution: string;
}

/** `POST /api/pay-weeks/:week/close` and `/reopen`: the state of a pay week. */
export interface PayWeekState {
  week: string;
  weekName: string;
  closed: boolean;
  closedAt: string | null;
  closedBy: string | null;
  reopenedAt: string | null;
  reopenReason: string | null;
}

export const reopenWeekSchema = z.object({
  reason: plainText(500, { min: 3, multiline: true, message: 'Say why the week is reopened' }),
});
export type ReopenWeekBody = z.infer<typeof reopenWeekSchema>;
