import { z } from 'zod';
import { decimal, idTextSchema, plainText } from '../input/fields.js';
import type { HoldReason } from '../bays/bays.schema.js';
import {
  OFFICE_ANSWER_CHANNELS,
  type AnswerChannel,
  type ApprovalLinkDto,
} from '../approvals/approvals.schema.js';
import {
  bookHoursSchema,
  jobLineInputSchema,
  type JobLineDto,
  type JobLineStatus,
} from '../work/work.schema.js';

/** How soon a finding needs the customer's attention. */
export const FINDING_SEVERITIES = ['safety-now', 'soon', 'watch'] as const;
export type FindingSeverity = (typeof FINDING_SEVERITIES)[number];

export const FINDING_ANSWERS = ['pending', 'approved', 'declined'] as const;
export type FindingAnswer = (typeof FINDING_ANSWERS)[number];

/** Photos are checked by their content, not by their name or the type the client claims. */
export const FINDING_PHOTO_TYPES = ['image/jpeg', 'image/png', 'image/webp'] as const;
export type FindingPhotoType = (typeof FINDING_PHOTO_TYPES)[number];
export const MAX_FINDING_PHOTOS = 6;
export const MAX_FINDING_PHOTO_BYTES = 10 * 1024 * 1024;

const emptyAsMissing = (value: unknown) =>
  typeof value === 'string' && value.trim() === '' ? undefined : value;

/**
 * The text fields of `POST /api/job-lines/:id/findings` (multipart/form-data, so every value arrives
 * as a string); the files go in `photos`.
 */
export const createFindingSchema = z.object({
  note: plainText(2000, { min: 1, multiline: true, message: 'Say what you found' }),
  severity: z.enum(FINDING_SEVERITIES, { error: 'Severity is safety-now, soon or watch' }),
  suggestedHours: z.preprocess(
    emptyAsMissing,
    decimal(
      z
        .number({ error: 'Suggested hours is a number of hours, like 1.5' })
        .min(0.1, 'Suggested hours is at least 0.1')
        .max(99.9, 'Suggested hours is at most 99.9'),
      'Suggested hours is a number of hours, like 1.5',
    ).optional(),
  ),
  holdForApproval: z.preprocess(
    emptyAsMissing,
    z.stringbool({ error: 'holdForApproval is true or false' }).default(false),
  ),
});
export type CreateFindingFields = z.input<typeof createFindingSchema>;
export type CreateFindingBody = z.output<typeof createFindingSchema>;

const officeChannelSchema = z.enum(OFFICE_ANSWER_CHANNELS, {
  error: 'Say how the customer answered: phone or in-person',
});

/** The office's answer once the customer said yes or no by phone or in person. */
export const findingAnswerSchema = z.discriminatedUnion(
  'answer',
  [
    z.object({
      answer: z.literal('approved'),
      channel: officeChannelSchema,
      bookHours: bookHoursSchema,
      /** The new line's title; the finding's note when left out. */
      title: jobLineInputSchema.shape.title.optional(),
    }),
    z.object({
      answer: z.literal('declined'),
      channel: officeChannelSchema,
      note: plainText(500, { multiline: true }).optional(),
    }),
  ],
  { error: 'The answer is approved or declined' },
);
export type FindingAnswerBody = z.infer<typeof findingAnswerSchema>;

/**
 * `PATCH /api/findings/:id/answer`: the customer changed their mind, or the answer was recorded
 * wrong. A yes turned into a no cancels the line the yes added (refused once that line is done).
 */
export const changeFindingAnswerSchema = z.discriminatedUnion(
  'answer',
  [
    z.object({
      answer: z.literal('approved'),
      channel: officeChannelSchema,
      bookHours: bookHoursSchema,
      title: jobLineInputSchema.shape.title.optional(),
      reason: plainText(300, { min: 3, multiline: true, message: 'Say why the answer changes' }),
    }),
    z.object({
      answer: z.literal('declined'),
      channel: officeChannelSchema,
      reason: plainText(300, { min: 3, multiline: true, message: 'Say why the answer changes' }),
    }),
  ],
  { error: 'The answer is approved or declined' },
);
export type ChangeFindingAnswerBody = z.infer<typeof changeFindingAnswerSchema>;

export const findingsQuerySchema = z.object({
  answer: z.enum(FINDING_ANSWERS).optional(),
  repairOrderId: idTextSchema.optional(),
});
export type FindingsQuery = z.infer<typeof findingsQuerySchema>;

export interface FindingPhotoDto {
  id: number;
  mimeType: FindingPhotoType;
  sizeBytes: number;
  /** The image bytes; send the bearer token (an `<img>` tag cannot: fetch it and use an object URL). */
  url: string;
  /** A JPEG about 640 px wide. */
  previewUrl: string;
}

/** One finding as the office inbox and the kiosk show it. */
export interface FindingDto {
  id: number;
  jobLineId: number;
  lineNo: number;
  lineTitle: string;
  lineStatus: JobLineStatus;
  holdReason: HoldReason | null;
  repairOrderId: number;
  repairOrderNumber: string;
  vehicle: string;
  customerName: string;
  /** Whether an approval request can be e-mailed. */
  customerHasEmail: boolean;
  /** Whether an approval request can be texted: the customer's phone is a valid number. */
  customerHasMobile: boolean;
  technicianId: number;
  technicianName: string;
  note: string;
  severity: FindingSeverity;
  suggestedHours: number | null;
  /** What the customer reads, once the advisor reviewed it; null until then. */
  customerWording: string | null;
  /** The hours and parts the advisor quotes; null until reviewed. */
  bookHours: number | null;
  partsCents: number | null;
  /** Hours × the shop's labour rate + parts, when quoted. */
  priceCents: number | null;
  answer: FindingAnswer;
  /** How the answer came: through the link, by phone or in person. */
  answerChannel: AnswerChannel | null;
  /** The office user who recorded it, or the name the customer signed on the page. */
  answeredBy: string | null;
  answeredAt: string | null;
  /** The reason given when declined. */
  answerNote: string | null;
  /** The job line an approval added. */
  createdLineId: number | null;
  /** When an approval request was last sent to the customer. */
  approvalRequestedAt: string | null;
  /** The last approval link sent for this finding. */
  approvalLink: ApprovalLinkDto | null;
  createdAt: string;
  photos: FindingPhotoDto[];
}

export interface FindingAnswerResult {
  finding: FindingDto;
  /** The new queued line when approved. */
  createdLine: JobLineDto | null;
  /** The finding's line when it was held for approval and nothing else on it waits for an answer. */
  resumedLine: JobLineDto | null;
}

/** An e-mail put in the outbox; the sender delivers it in the background and retries on failure. */
export interface MailQueued {
  mailId: number;
  to: string;
  subject: string;
  attachments: string[];
}

/** A message the local fake SMTP server received (when no real SMTP server is configured). */
export interface MailboxEntry {
  id: string;
  from: string;
  to: string[];
  subject: string;
  date: string;
  attachments: string[];
  sizeBytes: number;
}

export interface MailboxMessage extends MailboxEntry {
  text: string;
}
