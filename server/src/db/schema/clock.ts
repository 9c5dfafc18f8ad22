import {
  sqliteTable,
  integer,
  real,
  text,
  index,
  uniqueIndex,
  type AnySQLiteColumn,
} from 'drizzle-orm/sqlite-core';
import { BREAK_KINDS, PUNCH_KINDS, REVIEW_STATES, TIMER_KINDS, type DisplacedPunch } from '@baytime/shared';
import { oneOf } from './checks.js';
import { users } from './people.js';
import { bays, jobLines } from './work.js';

/**
 * Append-only. The id is the uuid the tablet made, so a replayed punch is found, not stored twice.
 * A correction is a new row that names the punch it `supersedes`; the original stays.
 */
export const punches = sqliteTable(
  'punches',
  {
    id: text('id').primaryKey(),
    technicianId: integer('technician_id')
      .notNull()
      .references(() => users.id),
    kind: text('kind', { enum: PUNCH_KINDS }).notNull(),
    jobLineId: integer('job_line_id').references(() => jobLines.id),
    breakKind: text('break_kind', { enum: BREAK_KINDS }),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    recordedAt: integer('recorded_at', { mode: 'timestamp_ms' }).notNull(),
    recordedBy: integer('recorded_by')
      .notNull()
      .references(() => users.id),
    /** A punch is superseded at most once: a later correction supersedes the newer record. */
    supersedes: text('supersedes').references((): AnySQLiteColumn => punches.id),
    reason: text('reason'),
    /** Takes the punch it supersedes out of the count without standing in for it. */
    voids: integer('voids', { mode: 'boolean' }).notNull().default(false),
  },
  (t) => [
    index('punches_technician_id_at_idx').on(t.technicianId, t.at),
    index('punches_job_line_id_at_idx').on(t.jobLineId, t.at),
    index('punches_at_idx').on(t.at),
    uniqueIndex('punches_supersedes_idx').on(t.supersedes),
    oneOf(t.kind, PUNCH_KINDS),
    oneOf(t.breakKind, BREAK_KINDS),
  ],
);

/**
 * A punch that arrived late and would have changed hours already counted. It is kept here, out of every
 * count, until the foreman accepts it (it is then copied into punches under the same id) or rejects it.
 */
export const heldPunches = sqliteTable(
  'held_punches',
  {
    id: text('id').primaryKey(),
    technicianId: integer('technician_id')
      .notNull()
      .references(() => users.id),
    kind: text('kind', { enum: PUNCH_KINDS }).notNull(),
    jobLineId: integer('job_line_id').references(() => jobLines.id),
    breakKind: text('break_kind', { enum: BREAK_KINDS }),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    recordedAt: integer('recorded_at', { mode: 'timestamp_ms' }).notNull(),
    recordedBy: integer('recorded_by')
      .notNull()
      .references(() => users.id),
    displaces: text('displaces', { mode: 'json' }).$type<DisplacedPunch[]>().notNull(),
    heldBecause: text('held_because').notNull(),
    review: text('review', { enum: REVIEW_STATES }).notNull().default('pending'),
    resolvedAt: integer('resolved_at', { mode: 'timestamp_ms' }),
    resolvedBy: integer('resolved_by').references(() => users.id),
    resolution: text('resolution'),
  },
  (t) => [index('held_punches_technician_id_at_idx').on(t.technicianId, t.at)],
);

export const timers = sqliteTable(
  'timers',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    bayId: integer('bay_id').references(() => bays.id),
    jobLineId: integer('job_line_id')
      .notNull()
      .references(() => jobLines.id),
    kind: text('kind', { enum: TIMER_KINDS }).notNull(),
    targetC: real('target_c'),
    ambientC: real('ambient_c'),
    durationSeconds: integer('duration_seconds'),
    label: text('label'),
    startedAt: integer('started_at', { mode: 'timestamp_ms' }).notNull(),
    startedBy: integer('started_by')
      .notNull()
      .references(() => users.id),
    reachedAt: integer('reached_at', { mode: 'timestamp_ms' }),
    endedAt: integer('ended_at', { mode: 'timestamp_ms' }),
  },
  (t) => [index('timers_bay_id_ended_at_idx').on(t.bayId, t.endedAt), oneOf(t.kind, TIMER_KINDS)],
);

export const timerReadings = sqliteTable(
  'timer_readings',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    timerId: integer('timer_id')
      .notNull()
      .references(() => timers.id),
    tempC: real('temp_c').notNull(),
    at: integer('at', { mode: 'timestamp_ms' }).notNull(),
    recordedBy: integer('recorded_by')
      .notNull()
      .references(() => users.id),
  },
  (t) => [index('timer_readings_timer_id_idx').on(t.timerId)],
);
