import { sqliteTable, index, integer, text } from 'drizzle-orm/sqlite-core';

/**
 * Sign-in attempts per badge, e-mail and client address, kept across restarts. An attempt is
 * counted before its secret is checked; `failures` reaching the limit locks the key for a time that
 * doubles with each lock (`lockStep`). A correct sign-in clears the account's row.
 */
export const signInThrottles = sqliteTable(
  'sign_in_throttles',
  {
    /** `badge:1042`, `email:jo@example.test` or `ip:192.0.2.7`. */
    key: text('key').primaryKey(),
    failures: integer('failures').notNull(),
    lockStep: integer('lock_step').notNull(),
    lockedUntil: integer('locked_until', { mode: 'timestamp_ms' }),
    lastAttemptAt: integer('last_attempt_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('sign_in_throttles_last_attempt_at_idx').on(t.lastAttemptAt)],
);
