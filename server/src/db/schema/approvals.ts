import { sqliteTable, integer, real, text, index, uniqueIndex, primaryKey } from 'drizzle-orm/sqlite-core';
import { FINDING_SEVERITIES } from '@baytime/shared';
import { findings } from './findings.js';
import { users } from './people.js';
import { repairOrders } from './work.js';

/**
 * A link sent to a customer to approve or decline findings. Only the SHA-256 of its token is kept:
 * the database alone cannot answer for the customer. Used once; the answer's origin is kept with it.
 */
export const approvalLinks = sqliteTable(
  'approval_links',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    tokenHash: text('token_hash').notNull(),
    repairOrderId: integer('repair_order_id')
      .notNull()
      .references(() => repairOrders.id),
    sentBy: integer('sent_by')
      .notNull()
      .references(() => users.id),
    sentTo: text('sent_to', { mode: 'json' }).$type<string[]>().notNull(),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    expiresAt: integer('expires_at', { mode: 'timestamp_ms' }).notNull(),
    revokedAt: integer('revoked_at', { mode: 'timestamp_ms' }),
    revokedBy: integer('revoked_by').references(() => users.id),
    usedAt: integer('used_at', { mode: 'timestamp_ms' }),
    signedName: text('signed_name'),
    answeredIp: text('answered_ip'),
    answeredUserAgent: text('answered_user_agent'),
  },
  (t) => [
    uniqueIndex('approval_links_token_hash_idx').on(t.tokenHash),
    index('approval_links_repair_order_id_idx').on(t.repairOrderId),
  ],
);

/** The findings a link asks about, as quoted when it was sent: the customer approves that price. */
export const approvalLinkFindings = sqliteTable(
  'approval_link_findings',
  {
    linkId: integer('link_id')
      .notNull()
      .references(() => approvalLinks.id),
    findingId: integer('finding_id')
      .notNull()
      .references(() => findings.id),
    wording: text('wording').notNull(),
    severity: text('severity', { enum: FINDING_SEVERITIES }).notNull(),
    bookHours: real('book_hours').notNull(),
    labourRateCents: integer('labour_rate_cents').notNull(),
    partsCents: integer('parts_cents'),
  },
  (t) => [
    primaryKey({ columns: [t.linkId, t.findingId] }),
    index('approval_link_findings_finding_id_idx').on(t.findingId),
  ],
);
