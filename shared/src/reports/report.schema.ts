import { z } from 'zod';
import { OVERTIME_RULES } from '../shop/shop.schema.js';
import { isoWeekSchema } from '../time/workweek.js';
import type { KpiName, LabourReportRow } from './kpis.js';

export const REPORT_FORMATS = ['json', 'csv'] as const;
export type ReportFormat = (typeof REPORT_FORMATS)[number];

/** `GET /api/reports/labour` and `/pay`: the shop workweek that starts in ISO week `week` (default: now). */
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

export interface LabourReportTechnician extends LabourReportRow {
  technicianId: number;
  name: string;
  lines: LabourReportLine[];
}

export interface LabourTrendWeek extends LabourReportRow {
  week: string;
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
  /** The shop over the LABOUR_TREND_WEEKS workweeks ending with this one, oldest first. */
  trend: LabourTrendWeek[];
  bayUtilisation: BayUtilisation[];
}

export interface PayReportTechnician {
  technicianId: number;
  name: string;
  flatRateCents: number;
  hourlyRateCents: number;
  overtimeExempt: boolean;
  flaggedHours: number;
  flaggedPayCents: number;
  nonProductivePayCents: number;
  straightTimeCents: number;
  /** Attendance hours: shift time less meal breaks, paid rest breaks included. */
  hoursWorked: number;
  regularRateCents: number;
  /** Hours paid a premium: time-and-a-half and double-time together. */
  overtimeHours: number;
  doubleTimeHours: number;
  overtimePremiumCents: number;
  minimumWageTopUpCents: number;
  totalCents: number;
  /** Flat-rate and non-productive pay fell short of the minimum wage for all hours worked. */
  underMinimumWage: boolean;
  /**
   * The week is still running and overtime applies to this technician, with NEAR_OVERTIME_HOURS or more
   * worked so far or projected for the week at the pace so far over the shop's opening hours.
   */
  nearOvertime: boolean;
}

export interface PayReportTotals {
  flaggedHours: number;
  hoursWorked: number;
  overtimeHours: number;
  doubleTimeHours: number;
  flaggedPayCents: number;
  nonProductivePayCents: number;
  straightTimeCents: number;
  overtimePremiumCents: number;
  minimumWageTopUpCents: number;
  totalCents: number;
}

export interface PayReport {
  week: string;
  from: string;
  to: string;
  timeZone: string;
  rules: (typeof OVERTIME_RULES)[number];
  minimumWageCents: number;
  /** PAY_ESTIMATE_CAUTION: the figures are an estimate. */
  caution: string;
  technicians: PayReportTechnician[];
  totals: PayReportTotals;
}
