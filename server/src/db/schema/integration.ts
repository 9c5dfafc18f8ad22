import { sql } from 'drizzle-orm';
import { sqliteTable, integer, text, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import {
  WEBHOOK_DELIVERY_STATUSES,
  WEBHOOK_EVENTS,
  type IntegrationScope,
  type WebhookEvent,
} from '@baytime/shared';
import { oneOf } from './checks.js';
import { users } from './people.js';

/** A key another system calls the API with. Only a hash of the key is kept; the key is shown once. */
export const integrationKeys = sqliteTable(
  'integration_keys',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    name: text('name').notNull(),
    scopes: text('scopes', { mode: 'json' }).$type<IntegrationScope[]>().notNull(),
    hint: text('hint').notNull(),
    secretHash: text('secret_hash').notNull(),
    createdBy: integer('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    lastUsedAt: integer('last_used_at', { mode: 'timestamp_ms' }),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
  },
  (t) => [
    uniqueIndex('integration_keys_secret_hash_idx').on(t.secretHash),
    // A revoked key keeps its name, so the key that replaces it can take the same one.
    uniqueIndex('integration_keys_active_name_idx')
      .on(t.name)
      .where(sql`${t.revokedAt} is null`),
  ],
);

/** An HTTPS endpoint that hears of the events it asked for, signed with its own secret. */
export const webhooks = sqliteTable('webhooks', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  url: text('url').notNull(),
  events: text('events', { mode: 'json' }).$type<WebhookEvent[]>().notNull(),
  /** Kept as it is: the server signs each delivery with it. */
  secret: text('secret').notNull(),
  createdBy: integer('created_by').references(() => users.id),
  createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
  revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
});

/**
 * The durable outbox: one row per event per endpoint, written in the transaction of the change it
 * announces, so an event is never announced for a change that rolled back nor lost on a restart.
 */
export const webhookDeliveries = sqliteTable(
  'webhook_deliveries',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    webhookId: integer('webhook_id')
      .notNull()
      .references(() => webhooks.id),
    event: text('event', { enum: WEBHOOK_EVENTS }).notNull(),
    /** The exact body sent, so every retry signs and sends the same bytes. */
    body: text('body').notNull(),
    status: text('status', { enum: WEBHOOK_DELIVERY_STATUSES }).notNull().default('pending'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    deliveredAt: integer('delivered_at', { mode: 'timestamp_ms' }),
  },
  (t) => [
    index('webhook_deliveries_status_next_attempt_at_idx').on(t.status, t.nextAttemptAt),
    index('webhook_deliveries_created_at_idx').on(t.createdAt),
    oneOf(t.event, WEBHOOK_EVENTS),
    oneOf(t.status, WEBHOOK_DELIVERY_STATUSES),
  ],
);

export const webhookAttempts = sqliteTable(
  'webhook_attempts',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    deliveryId: integer('delivery_id')
      .notNull()
      .references(() => webhookDeliveries.id),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    status: integer('status'),
    error: text('error'),
    durationMs: integer('duration_ms').notNull(),
  },
  (t) => [index('webhook_attempts_delivery_id_idx').on(t.deliveryId)],
);
