import { sqliteTable, integer, real, text, index } from 'drizzle-orm/sqlite-core';
import { ANSWER_CHANNELS, FINDING_ANSWERS, FINDING_SEVERITIES } from '@baytime/shared';
import { users } from './people.js';
import { jobLines } from './work.js';

export const findings = sqliteTable(
  'findings',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    jobLineId: integer('job_line_id')
      .notNull()
      .references(() => jobLines.id),
    technicianId: integer('technician_id')
      .notNull()
      .references(() => users.id),
    note: text('note').notNull(),
    severity: text('severity', { enum: FINDING_SEVERITIES }).notNull(),
    suggestedHours: real('suggested_hours'),
    /** The advisor's quote: what the customer reads and pays. Null until reviewed. */
    customerWording: text('customer_wording'),
    bookHours: real('book_hours'),
    partsCents: integer('parts_cents'),
    answer: text('answer', { enum: FINDING_ANSWERS }).notNull().default('pending'),
    answerChannel: text('answer_channel', { enum: ANSWER_CHANNELS }),
    /** An office user's answer; null when the customer answered through the link. */
    answeredBy: integer('answered_by').references(() => users.id),
    /** The name the customer signed on the approval page. */
    answeredName: text('answered_name'),
    answeredAt: integer('answered_at', { mode: 'timestamp_ms' }),
    createdLineId: integer('created_line_id').references(() => jobLines.id),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [
    index('findings_job_line_id_idx').on(t.jobLineId),
    // The inbox pages newest first, by answer or not.
    index('findings_answer_created_at_idx').on(t.answer, t.createdAt),
    index('findings_created_at_idx').on(t.createdAt),
  ],
);

/** A photo on disk under the data dir, named randomly by the server; never a client-given path. */
export const attachments = sqliteTable(
  'attachments',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    findingId: integer('finding_id')
      .notNull()
      .references(() => findings.id),
    storedName: text('stored_name').notNull(),
    previewName: text('preview_name'),
    mimeType: text('mime_type').notNull(),
    sizeBytes: integer('size_bytes').notNull(),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [index('attachments_finding_id_idx').on(t.findingId)],
);
