import { z } from 'zod';
import { idTextSchema } from '../input/fields.js';
import { isoWeekSchema } from '../time/workweek.js';
import type { PunchDto } from './punches.schema.js';

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

export interface Timecard {
  technician: { id: number; name: string };
  week: string;
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
    seconds: number;
  })[];
  days: TimecardDay[];
  totals: TimecardTotals;
  /** Punches that did not fit where they fell, with the reason. */
  anomalies: { punchId: string; reason: string }[];
  /** Things to look at in plain words, e.g. a shift still open from an earlier day. */
  flags: string[];
  audit: { at: string; actor: string; action: string; detail: Record<string, unknown> | null }[];
}
