import { sqliteTable, integer, real, text } from 'drizzle-orm/sqlite-core';
import { oneOf } from './checks.js';
import { CLOCK_FORMATS, CONCURRENT_SPLITS, UNIT_SYSTEMS, type OpeningHours } from '@baytime/shared';

/** One row (id 1): the shop's settings. The pay rules that take effect from a date are in `pay_rules`. */
export const shopSettings = sqliteTable(
  'shop_settings',
  {
    id: integer('id').primaryKey(),
    name: text('name').notNull(),
    timeZone: text('time_zone').notNull(),
    workweekStartDay: integer('workweek_start_day').notNull(),
    workweekStartHour: integer('workweek_start_hour').notNull(),
    units: text('units', { enum: UNIT_SYSTEMS }).notNull(),
    clockFormat: text('clock_format', { enum: CLOCK_FORMATS }).notNull().default('12h'),
    maxConcurrentJobs: integer('max_concurrent_jobs').notNull(),
    concurrentSplit: text('concurrent_split', { enum: CONCURRENT_SPLITS }).notNull(),
    openingHours: text('opening_hours', { mode: 'json' }).$type<OpeningHours>().notNull(),
    kioskIdleSeconds: integer('kiosk_idle_seconds').notNull(),
    minimumMealMinutes: integer('minimum_meal_minutes').notNull().default(30),
    longShiftHours: integer('long_shift_hours').notNull().default(14),
    minimumClockedMinutesForDone: integer('minimum_clocked_minutes_for_done').notNull().default(6),
    minimumClockedHoursForEfficiency: integer('minimum_clocked_hours_for_efficiency').notNull().default(8),
    apportionSpanningLines: integer('apportion_spanning_lines', { mode: 'boolean' }).notNull().default(true),
    kioskShowsPay: integer('kiosk_shows_pay', { mode: 'boolean' }).notNull().default(true),
    techniciansTakeUnassigned: integer('technicians_take_unassigned', { mode: 'boolean' })
      .notNull()
      .default(true),
    phone: text('phone'),
    labourRateCents: integer('labour_rate_cents').notNull().default(0),
    taxNote: text('tax_note').notNull().default(''),
    approvalLinkHours: integer('approval_link_hours').notNull().default(72),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
  },
  (t) => [
    oneOf(t.units, UNIT_SYSTEMS),
    oneOf(t.concurrentSplit, CONCURRENT_SPLITS),
    oneOf(t.clockFormat, CLOCK_FORMATS),
  ],
);

export const holdPresets = sqliteTable('hold_presets', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  durationSeconds: integer('duration_seconds').notNull(),
});

export const operations = sqliteTable('operations', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  title: text('title').notNull(),
  defaultBookHours: real('default_book_hours').notNull(),
  skillLevel: integer('skill_level').notNull().default(1),
  active: integer('active', { mode: 'boolean' }).notNull().default(true),
});

/**
 * The ledger rules the shop counted by before a change of them, each until the instant it changed: time
 * is counted under the rules of its moment, so a change never re-reads the past.
 */
export const earlierLedgerRules = sqliteTable(
  'earlier_ledger_rules',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    until: integer('until', { mode: 'timestamp_ms' }).notNull(),
    concurrentSplit: text('concurrent_split', { enum: CONCURRENT_SPLITS }).notNull(),
    minimumMealMinutes: integer('minimum_meal_minutes').notNull(),
  },
  (t) => [oneOf(t.concurrentSplit, CONCURRENT_SPLITS)],
);

/**
 * The shop's jobs-at-once limit before each change of it, until the instant it changed: a punch added
 * for a past moment (a correction, a held punch accepted) closes the lines the limit of that moment did.
 */
export const earlierJobLimits = sqliteTable('earlier_job_limits', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  until: integer('until', { mode: 'timestamp_ms' }).notNull(),
  maxConcurrentJobs: integer('max_concurrent_jobs').notNull(),
});
