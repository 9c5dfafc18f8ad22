import { z } from 'zod';
import { plainText } from '../input/fields.js';

/** What an integration key may do; a route names the scope it needs, and a key without it is refused. */
export const INTEGRATION_SCOPES = [
  'repair-orders:read',
  'repair-orders:write',
  'reports:read',
  'punches:read',
] as const;
export type IntegrationScope = (typeof INTEGRATION_SCOPES)[number];

/** Every key starts with this, so a key is told from a sign-in token before anything is looked up. */
export const INTEGRATION_KEY_PREFIX = 'btk_';

export const createIntegrationKeySchema = z
  .object({
    name: plainText(60, { min: 1, message: 'Name the key after the system that will use it' }),
    scopes: z
      .array(z.enum(INTEGRATION_SCOPES, { error: `A scope is one of ${INTEGRATION_SCOPES.join(', ')}` }))
      .min(1, 'Give the key at least one scope')
      .max(INTEGRATION_SCOPES.length)
      .refine((scopes) => new Set(scopes).size === scopes.length, 'Each scope once'),
  })
  .strict();
export type CreateIntegrationKeyBody = z.infer<typeof createIntegrationKeySchema>;

export interface IntegrationKeyDto {
  id: number;
  name: string;
  scopes: IntegrationScope[];
  /** The key's first characters, to tell keys apart; the rest is never shown again. */
  hint: string;
  createdAt: string;
  createdByName: string | null;
  lastUsedAt: string | null;
  revokedAt: string | null;
}

/** The answer to creating a key: the only time the whole key is shown. */
export interface CreatedIntegrationKey {
  key: IntegrationKeyDto;
  secret: string;
}

/** Events a webhook can ask for, with the payload each one carries in `data`. */
export const WEBHOOK_EVENTS = [
  'job-line.finished',
  'repair-order.ready',
  'finding.answered',
  'pay-week.closed',
] as const;
export type WebhookEvent = (typeof WEBHOOK_EVENTS)[number];

export interface WebhookPayloads {
  'job-line.finished': {
    jobLineId: number;
    repairOrderId: number;
    repairOrderNumber: string;
    externalRef: string | null;
    title: string;
    technicianId: number | null;
    completedAt: string;
  };
  'repair-order.ready': {
    repairOrderId: number;
    repairOrderNumber: string;
    externalRef: string | null;
    bayId: number | null;
    readyAt: string;
  };
  'finding.answered': {
    findingId: number;
    jobLineId: number;
    repairOrderId: number;
    answer: 'approved' | 'declined';
    answeredAt: string;
    createdLineId: number | null;
  };
  'pay-week.closed': {
    /** ISO week, `2030-W02`. */
    week: string;
    from: string;
    to: string;
    closedAt: string;
    /** Where the week's payroll CSV is read (with a key holding `reports:read`). */
    payrollCsvPath: string;
  };
}

/** The body of every delivery: `X-Baytime-Signature` signs `${timestamp}.${body}`. */
export interface WebhookEnvelope<E extends WebhookEvent = WebhookEvent> {
  id: string;
  event: E;
  occurredAt: string;
  data: WebhookPayloads[E];
}

const httpsUrl = z
  .url({ protocol: /^https$/, error: 'An https:// address' })
  .max(500, 'At most 500 characters');

export const createWebhookSchema = z
  .object({
    url: httpsUrl,
    events: z
      .array(z.enum(WEBHOOK_EVENTS, { error: `An event is one of ${WEBHOOK_EVENTS.join(', ')}` }))
      .min(1, 'Choose at least one event')
      .max(WEBHOOK_EVENTS.length)
      .refine((events) => new Set(events).size === events.length, 'Each event once'),
  })
  .strict();
export type CreateWebhookBody = z.infer<typeof createWebhookSchema>;

export interface WebhookDto {
  id: number;
  url: string;
  events: WebhookEvent[];
  createdAt: string;
  revokedAt: string | null;
}

/** The answer to registering a webhook: the signing secret, shown this once. */
export interface CreatedWebhook {
  webhook: WebhookDto;
  secret: string;
}

/** `cancelled`: the endpoint was stopped before the delivery got through; it is never tried again. */
export const WEBHOOK_DELIVERY_STATUSES = ['pending', 'delivered', 'failed', 'cancelled'] as const;
export type WebhookDeliveryStatus = (typeof WEBHOOK_DELIVERY_STATUSES)[number];

/** One try to deliver one event to one endpoint. */
export interface WebhookAttemptDto {
  at: string;
  /** The receiver's HTTP status; null when no answer came (refused, timed out, bad certificate). */
  status: number | null;
  error: string | null;
  durationMs: number;
}

export interface WebhookDeliveryDto {
  id: number;
  webhookId: number;
  url: string;
  event: WebhookEvent;
  status: WebhookDeliveryStatus;
  attempts: WebhookAttemptDto[];
  nextAttemptAt: string | null;
  createdAt: string;
}
