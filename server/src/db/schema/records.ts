import { sqliteTable, integer, text, index } from 'drizzle-orm/sqlite-core';
import { integrationKeys } from './integration.js';
import { oneOf } from './checks.js';
import { users } from './people.js';

export const auditLog = sqliteTable(
  'audit_log',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    actorId: integer('actor_id').references(() => users.id),
    action: text('action').notNull(),
    entity: text('entity').notNull(),
    entityId: text('entity_id').notNull(),
    detail: text('detail', { mode: 'json' }).$type<Record<string, unknown>>(),
    /** Set when the change came through an integration key: the key, not a person, did it. */
    integrationKeyId: integer('integration_key_id').references(() => integrationKeys.id),
  },
  (t) => [index('audit_log_entity_entity_id_idx').on(t.entity, t.entityId)],
);

export const MAIL_STATUSES = ['queued', 'sent', 'failed'] as const;
export const MESSAGE_CHANNELS = ['email', 'text'] as const;
export type MessageChannel = (typeof MESSAGE_CHANNELS)[number];

/** Every message the shop sends: e-mails and text messages, each on its channel. */
export const mailOutbox = sqliteTable(
  'mail_outbox',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    channel: text('channel', { enum: MESSAGE_CHANNELS }).notNull().default('email'),
    /** An e-mail address, or a phone number in E.164 for a text. */
    recipient: text('recipient').notNull(),
    /** E-mails only. */
    subject: text('subject'),
    text: text('text').notNull(),
    /** The body carries a secret (a customer's approval link): it is blanked once the message is sent. */
    secretBody: integer('secret_body', { mode: 'boolean' }).notNull().default(false),
    attachments: text('attachments', { mode: 'json' }).$type<{ filename: string; path: string }[]>(),
    status: text('status', { enum: MAIL_STATUSES }).notNull().default('queued'),
    attempts: integer('attempts').notNull().default(0),
    nextAttemptAt: integer('next_attempt_at', { mode: 'timestamp_ms' }).notNull(),
    lastError: text('last_error'),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    sentAt: integer('sent_at', { mode: 'timestamp_ms' }),
  },
  (t) => [
    index('mail_outbox_status_next_attempt_at_idx').on(t.status, t.nextAttemptAt),
    oneOf(t.channel, MESSAGE_CHANNELS),
    oneOf(t.status, MAIL_STATUSES),
  ],
);

/**
 * Changes to stored rows that a migration's SQL cannot make (they need the shop's rules in code). A
 * migration adds a row; start-up carries it out once, in one transaction with the row's removal.
 */
export const pendingUpgrades = sqliteTable('pending_upgrades', {
  name: text('name').primaryKey(),
});
