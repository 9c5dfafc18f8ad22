import { sqliteTable, integer, text, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { ROLES } from '@baytime/shared';
import { oneOf } from './checks.js';

export const users = sqliteTable(
  'users',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    name: text('name').notNull(),
    role: text('role', { enum: ROLES }).notNull(),
    email: text('email'),
    passwordHash: text('password_hash'),
    badge: text('badge'),
    pinHash: text('pin_hash'),
    skillLevel: integer('skill_level').notNull().default(1),
    active: integer('active', { mode: 'boolean' }).notNull().default(true),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    /** When the password or PIN last changed: sign-ins from before it are over. */
    credentialsChangedAt: integer('credentials_changed_at', { mode: 'timestamp_ms' }),
  },
  (t) => [
    uniqueIndex('users_email_idx').on(t.email),
    uniqueIndex('users_badge_idx').on(t.badge),
    oneOf(t.role, ROLES),
  ],
);

export const DEVICE_KINDS = ['wall', 'kiosk'] as const;
export type DeviceKind = (typeof DEVICE_KINDS)[number];

/**
 * A paired device: a wall screen (signs in with a `display` token) or a technicians' kiosk tablet
 * (a `kiosk` token that says which tablet it is). Paired once with a one-time code.
 */
export const screens = sqliteTable(
  'screens',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    kind: text('kind', { enum: DEVICE_KINDS }).notNull().default('wall'),
    name: text('name').notNull(),
    pairingCodeHash: text('pairing_code_hash'),
    pairingExpiresAt: integer('pairing_expires_at', { mode: 'timestamp_ms' }),
    pairedAt: integer('paired_at', { mode: 'timestamp_ms' }),
    lastSeenAt: integer('last_seen_at', { mode: 'timestamp_ms' }),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
    createdBy: integer('created_by').references(() => users.id),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    /** A kiosk's last report of its outbox: punches not yet sent, since when, and when it said so. */
    queueWaiting: integer('queue_waiting').notNull().default(0),
    queueSince: integer('queue_since', { mode: 'timestamp_ms' }),
    queueReportedAt: integer('queue_reported_at', { mode: 'timestamp_ms' }),
  },
  (t) => [uniqueIndex('screens_pairing_code_hash_idx').on(t.pairingCodeHash), oneOf(t.kind, DEVICE_KINDS)],
);
