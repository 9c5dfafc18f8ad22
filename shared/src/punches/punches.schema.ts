import { z } from 'zod';
import { idSchema, instantSchema, plainText } from '../input/fields.js';

export const PUNCH_KINDS = [
  'shift-in',
  'shift-out',
  'break-start',
  'break-end',
  'job-on',
  'job-off',
] as const;
export type PunchKind = (typeof PUNCH_KINDS)[number];

/**
 * 29 CFR 785.18/785.19: a short rest break is hours worked; a bona fide meal period is not. A "meal" shorter
 * than the shop's minimum, and a break of no stated kind, count as rest.
 */
export const BREAK_KINDS = ['meal', 'rest'] as const;
export type BreakKind = (typeof BREAK_KINDS)[number];

/** How far in the past an offline punch may be replayed. */
export const MAX_PUNCH_AGE_SECONDS = 12 * 3600;
/** Slack for tablet clocks that run a little ahead of the server. */
export const MAX_PUNCH_CLOCK_SKEW_SECONDS = 120;
/**
 * A punch recorded more than this after the time it carries arrived late (an offline replay): if it would
 * change hours already counted it is held for the foreman instead of refused.
 */
export const LATE_PUNCH_SECONDS = 120;

export const createPunchSchema = z
  .object({
    id: z.uuid(),
    kind: z.enum(PUNCH_KINDS),
    jobLineId: idSchema.optional(),
    at: instantSchema.optional(),
    breakKind: z.enum(BREAK_KINDS).optional(),
    technicianId: idSchema.optional(),
  })
  .superRefine((punch, ctx) => {
    const needsLine = punch.kind === 'job-on' || punch.kind === 'job-off';
    if (needsLine && punch.jobLineId === undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['jobLineId'],
        message: `A ${punch.kind} punch needs a job line`,
      });
    if (!needsLine && punch.jobLineId !== undefined)
      ctx.addIssue({
        code: 'custom',
        path: ['jobLineId'],
        message: `A ${punch.kind} punch takes no job line`,
      });
  });
export type CreatePunchBody = z.infer<typeof createPunchSchema>;

export const correctionSchema = z.object({
  punchId: z.uuid().optional(),
  technicianId: idSchema,
  kind: z.enum(PUNCH_KINDS),
  at: instantSchema,
  jobLineId: idSchema.optional(),
  breakKind: z.enum(BREAK_KINDS).optional(),
  reason: plainText(500, { min: 3, multiline: true, message: 'Say why the punch is corrected' }),
  /** The displaced punches the preview showed: a correction that displaces others is saved only with them. */
  displaces: z.array(z.uuid()).max(50).optional(),
});
export type CorrectionBody = z.infer<typeof correctionSchema>;

/**
 * `POST /api/timecards/voids`: a punch that should never have been made (a tap on the wrong line, a badge
 * left signed in) is taken out of the count without a punch in its place; it stays on record, struck through.
 */
export const voidPunchSchema = correctionSchema.pick({ technicianId: true, displaces: true }).extend({
  punchId: z.uuid(),
  reason: plainText(500, { min: 3, multiline: true, message: 'Say why the punch is taken out' }),
});
export type VoidPunchBody = z.infer<typeof voidPunchSchema>;

export interface PunchDto {
  id: string;
  technicianId: number;
  kind: PunchKind;
  jobLineId: number | null;
  breakKind: BreakKind | null;
  at: string;
  recordedAt: string;
  recordedBy: number;
  supersedes: string | null;
  reason: string | null;
  /** It takes the punch it supersedes out of the count without standing in for it (a displaced punch). */
  voids: boolean;
}

export const REVIEW_STATES = ['pending', 'accepted', 'rejected'] as const;
export type ReviewState = (typeof REVIEW_STATES)[number];

/** A counted punch a late or corrected punch would make impossible, in plain words. */
export interface DisplacedPunch {
  id: string;
  kind: PunchKind;
  at: string;
  /** "the clock-on at 3:10 PM (RO 4410 · Replace water pump)". */
  words: string;
}

/**
 * A punch that arrived late (an offline replay) and would have changed hours already counted: kept, left out
 * of every count, until the foreman accepts it (it counts, and what it displaces is voided) or rejects it.
 * `POST /api/punches` answers 202 with it.
 */
export interface HeldPunchDto extends Omit<PunchDto, 'supersedes' | 'reason' | 'voids'> {
  review: ReviewState;
  displaces: DisplacedPunch[];
  /** Why it was held, in plain words. */
  heldBecause: string;
  resolvedAt: string | null;
  resolvedBy: number | null;
  resolution: string | null;
}

/** What a correction would do, before it is saved (`?preview=true`). */
export interface CorrectionPreview {
  /** Why it cannot be saved where it falls; null when it fits. */
  refusal: string | null;
  /** Counted punches it would make impossible: they are voided with it once confirmed. */
  displaces: DisplacedPunch[];
  /**
   * What goes with it: the clock-offs a clock-on records for the lines it closes at the jobs-at-once
   * limit, or, for a clock-on taken out, those it recorded, taken out too.
   */
  withIt: DisplacedPunch[];
  /** What it does to the counted time around it, in whole seconds: below zero when it takes time off. */
  change: { attendanceSeconds: number; clockedSeconds: number };
}
