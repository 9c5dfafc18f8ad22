import type { WeekSummary } from './report.schema.js';

export interface LabourHours {
  attendanceHours: number;
  /** Time clocked on job lines in the week. */
  clockedHours: number;
  /** Book hours of the lines finished in the week (each technician's share). */
  flaggedHours: number;
  /** All the time clocked on those same finished lines, in any week: efficiency's matched divisor. */
  matchedClockedHours: number;
  /** Time clocked in the week on lines not finished by its end. */
  workInProgressHours: number;
}

/**
 * A week's labour in whole seconds: the one figure the labour report and the pay summary both show, each
 * hour figure rounded once from it, and what shop totals add up.
 */
export interface LabourSeconds {
  attendanceSeconds: number;
  clockedSeconds: number;
  flaggedSeconds: number;
  matchedClockedSeconds: number;
  workInProgressSeconds: number;
}

const HOUR_S = 3600;

/** Unrounded hours of whole seconds, for the ratios. */
export function labourHoursOf(seconds: LabourSeconds): LabourHours {
  return {
    attendanceHours: seconds.attendanceSeconds / HOUR_S,
    clockedHours: seconds.clockedSeconds / HOUR_S,
    flaggedHours: seconds.flaggedSeconds / HOUR_S,
    matchedClockedHours: seconds.matchedClockedSeconds / HOUR_S,
    workInProgressHours: seconds.workInProgressSeconds / HOUR_S,
  };
}

/** The shop's week: each figure the sum of the technicians' whole seconds. */
export function shopLabourSeconds(technicians: readonly LabourSeconds[]): LabourSeconds {
  const add = (pick: (s: LabourSeconds) => number) => technicians.reduce((sum, s) => sum + pick(s), 0);
  return {
    attendanceSeconds: add((s) => s.attendanceSeconds),
    clockedSeconds: add((s) => s.clockedSeconds),
    flaggedSeconds: add((s) => s.flaggedSeconds),
    matchedClockedSeconds: add((s) => s.matchedClockedSeconds),
    workInProgressSeconds: add((s) => s.workInProgressSeconds),
  };
}

/** Ratios as fractions (0.9 = 90 %); null when the divisor is under a tenth of an hour. */
export interface LabourKpis {
  productivity: number | null;
  efficiency: number | null;
  proficiency: number | null;
}

export type LabourReportRow = LabourHours & LabourKpis;

export type KpiName = keyof LabourKpis;

/** NADA guidelines as quoted by a dealer association bulletin, "Measuring technician performance". */
export const KPI_GUIDELINES: Record<KpiName, { low: number; high: number }> = {
  productivity: { low: 0.85, high: 0.875 },
  efficiency: { low: 1.25, high: 1.25 },
  proficiency: { low: 1, high: 1 },
};

export const KPI_FORMULAS: Record<KpiName, string> = {
  productivity: 'Productivity = clocked job hours ÷ attendance hours',
  efficiency:
    'Efficiency = flagged hours of the lines finished this week ÷ all the hours clocked on those same lines, in any week',
  proficiency: 'Proficiency = flagged hours ÷ attendance hours',
};

/** Why efficiency is matched, and what work in progress is. */
export const EFFICIENCY_NOTE =
  'Efficiency compares each finished line with the time clocked on it, whenever that was, so a long job does ' +
  'not swing one week to 0 % and the next to 200 %. Work in progress is the time clocked this week on lines ' +
  'not finished yet: it counts in efficiency the week the line is finished.';

/**
 * How the report's hours are rounded, in words: the labour page and CSV state it beside the shop total, which is
 * the sum of the technicians' exact whole seconds rounded once (as the pay summary's hour totals are).
 */
export const HOURS_ROUNDING_RULE =
  'Hours are added up in whole seconds and each figure is rounded once, the shop total from the exact sum: it ' +
  'can differ from adding up the rounded rows, by up to 0.0001 h a row at 4 decimals (CSV) and 0.05 h a row ' +
  'at 1 decimal (page).';

export const KPI_NAMES_NOTE =
  'Trade sources disagree on these names (some call flagged ÷ attendance hours "productivity"): read the formulas.';

/**
 * The smallest divisor a ratio is taken over: a tenth of an hour, the unit hours are flagged in (common
 * practice, no source). Over a few seconds of attendance a ratio reads thousands of per cent and means nothing.
 */
export const MIN_RATIO_DIVISOR_HOURS = 0.1;

const ratio = (numerator: number, denominator: number) =>
  denominator >= MIN_RATIO_DIVISOR_HOURS ? numerator / denominator : null;

export function labourKpis(hours: LabourHours): LabourReportRow {
  const { attendanceHours, clockedHours, flaggedHours, matchedClockedHours, workInProgressHours } = hours;
  return {
    attendanceHours,
    clockedHours,
    flaggedHours,
    matchedClockedHours,
    workInProgressHours,
    productivity: ratio(clockedHours, attendanceHours),
    efficiency: ratio(flaggedHours, matchedClockedHours),
    proficiency: ratio(flaggedHours, attendanceHours),
  };
}

/** Shop figures: hours summed over technicians first, then the ratios (never an average of ratios). */
export function shopLabourKpis(technicians: readonly LabourHours[]): LabourReportRow {
  const add = (pick: (h: LabourHours) => number) => technicians.reduce((sum, h) => sum + pick(h), 0);
  return labourKpis({
    attendanceHours: add((h) => h.attendanceHours),
    clockedHours: add((h) => h.clockedHours),
    flaggedHours: add((h) => h.flaggedHours),
    matchedClockedHours: add((h) => h.matchedClockedHours),
    workInProgressHours: add((h) => h.workInProgressHours),
  });
}

/**
 * Share a line's book hours among the technicians who worked it, in proportion to their clocked seconds
 * on it; a line nobody clocked on is flagged to its assigned technician, if any (common practice).
 */
export function shareFlaggedHours(
  bookHours: number,
  clockedSecondsByTechnician: ReadonlyMap<number, number>,
  assignedTechnicianId: number | null,
): Map<number, number> {
  const total = [...clockedSecondsByTechnician.values()].reduce((sum, s) => sum + s, 0);
  if (total <= 0) return new Map(assignedTechnicianId === null ? [] : [[assignedTechnicianId, bookHours]]);
  return new Map(
    [...clockedSecondsByTechnician]
      .filter(([, seconds]) => seconds > 0)
      .map(([technicianId, seconds]) => [technicianId, (bookHours * seconds) / total]),
  );
}

/**
 * The flagged hours a closed week was paid on, when they differ from what the week flags today (a line of
 * it finished, edited or reopened since; the difference is carried to the next open week), or null.
 */
export function flaggedWhenClosed(summary: Pick<WeekSummary, 'closed' | 'labour' | 'pay'>): number | null {
  if (!summary.closed || !summary.pay) return null;
  return Math.abs(summary.pay.flaggedHours - summary.labour.flaggedHours) >= 0.05
    ? summary.pay.flaggedHours
    : null;
}
