import { z } from 'zod';
import { plainText } from '../input/fields.js';
import { isoWeekSchema } from '../time/workweek.js';

/**
 * Things the foreman must look at before a week's pay is trusted. The ledger ones clear when the timecard
 * is corrected or when the foreman marks them reviewed; a held punch clears when accepted or rejected; a
 * line done without clocked time when it is signed off (or reopened).
 */
export const EXCEPTION_KINDS = [
  'open-shift',
  'open-break',
  'long-rest',
  'short-meal',
  'held-punch',
  'done-unclocked',
] as const;
export type ExceptionKind = (typeof EXCEPTION_KINDS)[number];

export interface TimeException {
  kind: ExceptionKind;
  /** Stable key: the kind and the punch or line it is about. */
  key: string;
  technicianId: number;
  technicianName: string;
  /** When it happened (the punch or the line's completion). */
  at: string;
  /** In plain words, with the times in the shop's zone. */
  text: string;
  /** Set once someone dealt with it; it then no longer counts as unresolved. */
  resolution: { by: string; at: string; note: string } | null;
  /** The held punch or job line, for the actions that resolve it. */
  punchId: string | null;
  jobLineId: number | null;
}

export interface ExceptionList {
  week: string;
  from: string;
  to: string;
  timeZone: string;
  exceptions: TimeException[];
  unresolved: number;
}

export const exceptionsQuerySchema = z.object({ week: isoWeekSchema.optional() });
export type ExceptionsQuery = z.infer<typeof exceptionsQuerySchema>;

/** A ledger exception the foreman checked and accepts as it is (a genuine short meal, say). */
export const reviewExceptionSchema = z.object({
  key: z.string().min(3).max(120),
  note: plainText(500, { min: 3, multiline: true, message: 'Say what was checked' }),
});
export type ReviewExceptionBody = z.infer<typeof reviewExceptionSchema>;

/** Accept or reject a held punch; sign off a line done without clocked time. Always with a reason. */
export const resolutionSchema = z.object({
  reason: plainText(500, { min: 3, multiline: true, message: 'Say why' }),
});
export type ResolutionBody = z.infer<typeof resolutionSchema>;
