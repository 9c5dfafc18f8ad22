import { sqliteTable, integer, text, index } from 'drizzle-orm/sqlite-core';
import { BREAK_KINDS, OFFLINE_PUNCH_KINDS, OFFLINE_PUNCH_STATUSES } from '@baytime/shared';
import { screens, users } from './people.js';

/**
 * A shift or break punch a kiosk recorded while the shop server was out of reach, identified by a
 * badge and a PIN sealed on the tablet to this server's key. It counts nowhere until it is confirmed
 * (at the technician's next sign-in online, or by the foreman); then it becomes a punch with the same
 * id and its tapped time. A wrong PIN is kept as refused, for the foreman to see.
 */
export const offlinePunches = sqliteTable(
  'offline_punches',
  {
    id: text('id').primaryKey(),
    kioskId: integer('kiosk_id')
      .notNull()
      .references(() => screens.id),
    badge: text('badge'),
    technicianId: integer('technician_id').references(() => users.id),
    kind: text('kind', { enum: OFFLINE_PUNCH_KINDS }).notNull(),
    breakKind: text('break_kind', { enum: BREAK_KINDS }),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    status: text('status', { enum: OFFLINE_PUNCH_STATUSES }).notNull(),
    /** Why it was refused, or why confirming it did not work; null otherwise. */
    problem: text('problem'),
    receivedAt: integer('received_at', { mode: 'timestamp_ms' }).notNull(),
    decidedAt: integer('decided_at', { mode: 'timestamp_ms' }),
    decidedBy: integer('decided_by').references(() => users.id),
  },
  (t) => [
    index('offline_punches_status_at_idx').on(t.status, t.at),
    index('offline_punches_technician_id_status_idx').on(t.technicianId, t.status),
  ],
);
