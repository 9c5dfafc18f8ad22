import { z } from 'zod';
import type { TimeException } from '../exceptions/exceptions.schema.js';
import { idTextSchema } from '../input/fields.js';
import type { WeekSummary } from '../reports/report.schema.js';
import { isoWeekSchema } from '../time/workweek.js';
import type { HeldPunchDto, PunchDto } from './punches.schema.js';

export const timecardQuerySchema = z.object({
  technicianId: idTextSchema.optional(),
  week: isoWeekSchema.optional(),
});
export type TimecardQuery = z.infer<typeof timecardQuerySchema>;

export interface TimecardTotals {
  attendanceSeconds: number;
  clockedSeconds: number;
  idleSeconds: number;
  mealBreakSeconds: number;
  restBreakSeconds: number;
}

export interface TimecardDay extends TimecardTotals {
  /** Local calendar day the workday starts on, 'YYYY-MM-DD'. */
  day: string;
}

export interface TimecardPunch extends PunchDto {
  /** A later correction replaced it; it stays on the card, struck through. */
  supersededBy: string | null;
  recordedByName: string;
}

export interface TimecardInterval {
  from: string;
  to: string;
  open: boolean;
}

export const correctionQuerySchema = z.object({
  /** `true`: say what the correction would do, save nothing. */
  preview: z.enum(['true', 'false']).optional(),
});
export type CorrectionQuery = z.infer<typeof correctionQuerySchema>;

export interface Timecard {
  technician: { id: number; name: string };
  week: string;
  /** "Week of Sun, Nov 29". */
  weekName: string;
  from: string;
  to: string;
  timeZone: string;
  punches: TimecardPunch[];
  shifts: TimecardInterval[];
  breaks: (TimecardInterval & { kind: 'meal' | 'rest' })[];
  jobs: (TimecardInterval & {
    jobLineId: number;
    title: string;
    repairOrderNumber: string;
    /** Its length within the week. */
    seconds: number;
    /** What the line is credited for it within the week, after the shop's split of time on several lines. */
    countedSeconds: number;
  })[];
  /** Every line a punch of the card names, those taken out of the count included. */
  lines: { jobLineId: number; title: string; repairOrderNumber: string }[];
  days: TimecardDay[];
  totals: TimecardTotals;
  /** Punches that did not fit where they fell, with the reason. */
  anomalies: { punchId: string; reason: string }[];
  /** Things to look at in plain words, e.g. a shift still open from an earlier day. */
  flags: string[];
  /** Late punches kept out of the count until the foreman accepts or rejects them. */
  held: HeldPunchDto[];
  /** The week's exceptions for this technician (see the shop-wide list). */
  exceptions: TimeException[];
  /** The week closed for pay: nothing dated in it can change. */
  closed: boolean;
  /** Flagged, clocked, efficiency and (where shown) estimated pay: the figures of the reports. */
  summary: WeekSummary;
  audit: { at: string; actor: string; action: string; detail: Record<string, unknown> | null }[];
}
