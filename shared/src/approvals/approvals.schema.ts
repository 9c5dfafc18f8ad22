import { z } from 'zod';
import { idSchema, plainText } from '../input/fields.js';
import { bookHoursSchema } from '../work/work.schema.js';
import type { FindingSeverity, MailQueued } from '../findings/findings.schema.js';

/** How a customer's answer reached the shop: through the approval link, by phone, or in person. */
export const ANSWER_CHANNELS = ['link', 'phone', 'in-person'] as const;
export type AnswerChannel = (typeof ANSWER_CHANNELS)[number];
/** The ways the office records an answer itself; `link` answers come from the customer's page. */
export const OFFICE_ANSWER_CHANNELS = ['phone', 'in-person'] as const;
export type OfficeAnswerChannel = (typeof OFFICE_ANSWER_CHANNELS)[number];

/** Parts amounts the office can quote: up to $100,000. */
export const MAX_PARTS_CENTS = 10_000_000;

/**
 * `PATCH /api/findings/:id/quote`: what the customer will read and pay, reviewed by the advisor.
 * The technician's note stays in the shop; the wording is what the customer sees.
 */
export const findingQuoteSchema = z.object({
  customerWording: plainText(1000, {
    min: 1,
    multiline: true,
    message: 'Write what the customer will read',
  }),
  bookHours: bookHoursSchema,
  partsCents: z
    .number({ error: 'Parts is an amount in cents' })
    .int('Parts is a whole number of cents')
    .min(0, 'Parts cannot be negative')
    .max(MAX_PARTS_CENTS, 'Parts is at most $100,000')
    .nullable()
    .default(null),
});
export type FindingQuoteBody = z.input<typeof findingQuoteSchema>;

export const APPROVAL_LINK_STATUSES = ['active', 'expired', 'revoked', 'used'] as const;
export type ApprovalLinkStatus = (typeof APPROVAL_LINK_STATUSES)[number];

/** The last approval link sent for a finding, as the office sees it (never the token itself). */
export interface ApprovalLinkDto {
  id: number;
  sentAt: string;
  expiresAt: string;
  status: ApprovalLinkStatus;
  /** Where it went: an e-mail address and/or a phone number. */
  sentTo: string[];
}

/** A text message put in the outbox; the sender delivers it in the background and retries on failure. */
export interface TextQueued {
  textId: number;
  to: string;
}

/** A notice to a customer, by e-mail and/or text: whichever of their contacts the shop has. */
export interface NoticesQueued {
  mail: MailQueued | null;
  text: TextQueued | null;
}

/** `POST /api/findings/:id/request-approval`: the link, and the messages that carry it. */
export interface ApprovalRequested extends NoticesQueued {
  approvalUrl: string;
  expiresAt: string;
  link: ApprovalLinkDto;
  /** The findings of the repair order the page asks about (this one and any other reviewed ones). */
  findingIds: number[];
}

/** One finding on the customer's page: the advisor's wording and the quoted price. */
export interface PublicApprovalFinding {
  id: number;
  wording: string;
  severity: FindingSeverity;
  severityWords: string;
  bookHours: number;
  labourCents: number;
  partsCents: number;
  priceCents: number;
  photos: { url: string; previewUrl: string }[];
}

/** `GET /api/public/approvals/:token`: everything the customer's page shows. */
export interface PublicApproval {
  /** `timeZone`: the shop's IANA zone, in which the page states its times, whatever the phone's. */
  shop: { name: string; phone: string | null; timeZone: string };
  repairOrderNumber: string;
  vehicle: string;
  labourRateCents: number;
  taxNote: string;
  expiresAt: string;
  findings: PublicApprovalFinding[];
  totalCents: number;
}

export const publicApprovalAnswerSchema = z
  .object({
    answers: z
      .array(
        z.object({
          findingId: idSchema,
          answer: z.enum(['approved', 'declined'], { error: 'Approve or decline each item' }),
        }),
      )
      .min(1, 'Approve or decline each item')
      .max(30),
    signedName: plainText(80, { min: 2, message: 'Type your name to sign' }),
  })
  .refine((body) => new Set(body.answers.map((a) => a.findingId)).size === body.answers.length, {
    path: ['answers'],
    message: 'Answer each item once',
  });
export type PublicApprovalAnswerBody = z.infer<typeof publicApprovalAnswerSchema>;

/** What the customer's page shows once the answer is in. */
export interface PublicApprovalResult {
  answeredAt: string;
  signedName: string;
  approvedCents: number;
  answers: { findingId: number; answer: 'approved' | 'declined' }[];
}

/** A text message the local fake received (when no SMS provider is configured). */
export interface TextboxEntry {
  id: string;
  from: string;
  to: string;
  body: string;
  date: string;
}
