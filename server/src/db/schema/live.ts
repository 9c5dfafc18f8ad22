import { sqliteTable, integer } from 'drizzle-orm/sqlite-core';

/**
 * One row (id 1): the highest live `seq` that may have been sent. Reserved a block ahead, so no
 * message waits for a write and a restart carries on above anything sent before.
 */
export const liveSequence = sqliteTable('live_sequence', {
  id: integer('id').primaryKey(),
  reservedUpTo: integer('reserved_up_to').notNull(),
});
