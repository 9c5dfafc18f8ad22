import { sqliteTable, integer, real, text } from 'drizzle-orm/sqlite-core';

/**
 * One row (id 1): the technicians' efficiencies as last counted (four weeks of clocked time, most of
 * a second on a big shop). After a restart the wall's late count starts from them at once, and the
 * recount waits until the screens are back.
 */
export const storedEfficiencies = sqliteTable('stored_efficiencies', {
  id: integer('id').primaryKey(),
  countedAt: integer('counted_at', { mode: 'timestamp_ms' }).notNull(),
  minimumHours: real('minimum_hours').notNull(),
  shop: real('shop'),
  /** `[technicianId, efficiency or null][]`. */
  byTechnician: text('by_technician', { mode: 'json' }).$type<[number, number | null][]>().notNull(),
});
