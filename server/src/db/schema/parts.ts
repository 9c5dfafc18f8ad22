import { sql } from 'drizzle-orm';
import { sqliteTable, integer, text, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { PARTS_STATES } from '@baytime/shared';
import { users } from './people.js';
import { jobLines } from './work.js';

/**
 * What a line held for parts waits for. The technician may name the part when holding; the office
 * records the state, supplier and expected arrival, and marks it received, which sends the line
 * back to its technician. A line has at most one open (not received) row; received rows stay.
 */
export const partsHolds = sqliteTable(
  'parts_holds',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    jobLineId: integer('job_line_id')
      .notNull()
      .references(() => jobLines.id),
    part: text('part'),
    state: text('state', { enum: PARTS_STATES }),
    supplier: text('supplier'),
    expectedAt: integer('expected_at', { mode: 'timestamp_ms' }),
    receivedAt: integer('received_at', { mode: 'timestamp_ms' }),
    receivedBy: integer('received_by').references(() => users.id),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [
    uniqueIndex('parts_holds_open_job_line_id_idx')
      .on(t.jobLineId)
      .where(sql`${t.receivedAt} is null`),
    index('parts_holds_job_line_id_idx').on(t.jobLineId),
  ],
);
