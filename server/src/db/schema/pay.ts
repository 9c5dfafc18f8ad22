import { sqliteTable, integer, text, index, uniqueIndex } from 'drizzle-orm/sqlite-core';
import { OVERTIME_RULES, PAY_TYPES, type PayReport } from '@baytime/shared';

/** What closing a week keeps: the pay summary, and the lines it flagged (to spot later edits). */
export interface PayWeekSnapshot {
  report: PayReport;
  lineIds: number[];
}
import { users } from './people.js';

/**
 * A technician's rates, each from a date (a calendar day in the shop's zone) until the next one. A week is
 * paid with the rate in force on its first day, so a raise dated next month never changes this week.
 */
export const payRates = sqliteTable(
  'pay_rates',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    userId: integer('user_id')
      .notNull()
      .references(() => users.id),
    effectiveFrom: text('effective_from').notNull(),
    payType: text('pay_type', { enum: PAY_TYPES }).notNull(),
    flatRateCents: integer('flat_rate_cents').notNull(),
    hourlyRateCents: integer('hourly_rate_cents').notNull(),
    guaranteeCents: integer('guarantee_cents').notNull(),
    overtimeExempt: integer('overtime_exempt', { mode: 'boolean' }).notNull(),
    recordedAt: integer('recorded_at', { mode: 'timestamp_ms' }).notNull(),
    recordedBy: integer('recorded_by').references(() => users.id),
  },
  (t) => [uniqueIndex('pay_rates_user_id_effective_from_idx').on(t.userId, t.effectiveFrom)],
);

/** The shop's pay rules from a date, like the rates. */
export const payRules = sqliteTable(
  'pay_rules',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    effectiveFrom: text('effective_from').notNull(),
    overtimeRules: text('overtime_rules', { enum: OVERTIME_RULES }).notNull(),
    minimumWageCents: integer('minimum_wage_cents').notNull(),
    localMinimumWageCents: integer('local_minimum_wage_cents'),
    payNonProductiveSeparately: integer('pay_non_productive_separately', { mode: 'boolean' }).notNull(),
    recordedAt: integer('recorded_at', { mode: 'timestamp_ms' }).notNull(),
    recordedBy: integer('recorded_by').references(() => users.id),
  },
  (t) => [uniqueIndex('pay_rules_effective_from_idx').on(t.effectiveFrom)],
);

/**
 * A pay week closed by the owner, with the pay summary as it stood when first closed (figures and rates used):
 * what payroll was given. Reopened and closed again, it keeps those figures, and any difference is carried to
 * the next open week.
 */
export const payWeeks = sqliteTable('pay_weeks', {
  week: text('week').primaryKey(),
  closedAt: integer('closed_at', { mode: 'timestamp_ms' }),
  closedBy: integer('closed_by').references(() => users.id),
  snapshot: text('snapshot', { mode: 'json' }).$type<PayWeekSnapshot>(),
  /** When `snapshot` was taken: the week's first close. */
  paidAt: integer('paid_at', { mode: 'timestamp_ms' }),
  reopenedAt: integer('reopened_at', { mode: 'timestamp_ms' }),
  reopenedBy: integer('reopened_by').references(() => users.id),
  reopenReason: text('reopen_reason'),
});

/** A timecard exception the foreman checked and accepted as it is. */
export const exceptionReviews = sqliteTable(
  'exception_reviews',
  {
    key: text('key').primaryKey(),
    technicianId: integer('technician_id')
      .notNull()
      .references(() => users.id),
    reviewedBy: integer('reviewed_by')
      .notNull()
      .references(() => users.id),
    reviewedAt: integer('reviewed_at', { mode: 'timestamp_ms' }).notNull(),
    note: text('note').notNull(),
  },
  (t) => [index('exception_reviews_technician_id_idx').on(t.technicianId)],
);
