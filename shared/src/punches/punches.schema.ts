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

/** 29 CFR 785.18/785.19: a short rest break is hours worked; a bona fide meal period is not. */
export const BREAK_KINDS = ['meal', 'rest'] as const;
export type BreakKind = (typeof BREAK_KINDS)[number];

/** How far in the past an offline punch may be replayed. */
export const MAX_PUNCH_AGE_SECONDS = 12 * 3600;
/** Slack for tablet clocks that run a little ahead of the server. */
export const MAX_PUNCH_CLOCK_SKEW_SECONDS = 120;

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
});
export type CorrectionBody = z.infer<typeof correctionSchema>;

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
}
