import { sql } from 'drizzle-orm';
import {
  sqliteTable,
  integer,
  real,
  text,
  index,
  uniqueIndex,
  type AnySQLiteColumn,
} from 'drizzle-orm/sqlite-core';
import {
  BAY_KINDS,
  HOLD_REASONS,
  JOB_LINE_STATUSES,
  PRIORITIES,
  REPAIR_ORDER_STATUSES,
  SIGN_OFF_STATES,
} from '@baytime/shared';
import { oneOf } from './checks.js';
import { users } from './people.js';

export const BAY_PHASES = ['free', 'staged', 'check', 'ready'] as const;

export const customers = sqliteTable('customers', {
  id: integer('id').primaryKey({ autoIncrement: true }),
  name: text('name').notNull(),
  phone: text('phone'),
  email: text('email'),
  createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
});

export const vehicles = sqliteTable(
  'vehicles',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    customerId: integer('customer_id')
      .notNull()
      .references(() => customers.id),
    vin: text('vin').notNull(),
    year: integer('year').notNull(),
    make: text('make').notNull(),
    model: text('model').notNull(),
    plate: text('plate'),
    lastOdometer: integer('last_odometer'),
  },
  (t) => [uniqueIndex('vehicles_vin_idx').on(t.vin)],
);

/**
 * A bay's own phase; the board shows `timer`, `working` or `held` on top of it when a timer runs,
 * someone is clocked on, or the line in the bay is held.
 */
export const bays = sqliteTable(
  'bays',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    name: text('name').notNull(),
    kind: text('kind', { enum: BAY_KINDS }).notNull().default('two-post'),
    position: integer('position').notNull().default(0),
    active: integer('active', { mode: 'boolean' }).notNull().default(true),
    phase: text('phase', { enum: BAY_PHASES }).notNull().default('free'),
    phaseSince: integer('phase_since', { mode: 'timestamp_ms' }).notNull(),
    repairOrderId: integer('repair_order_id').references((): AnySQLiteColumn => repairOrders.id),
  },
  (t) => [
    // Unique among all bays, active or not, as the owner's form checks: a past bay's name stays its own.
    uniqueIndex('bays_name_idx').on(t.name),
    oneOf(t.kind, BAY_KINDS),
    oneOf(t.phase, BAY_PHASES),
  ],
);

export const repairOrders = sqliteTable(
  'repair_orders',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    number: text('number').notNull(),
    customerId: integer('customer_id')
      .notNull()
      .references(() => customers.id),
    vehicleId: integer('vehicle_id')
      .notNull()
      .references(() => vehicles.id),
    advisorId: integer('advisor_id').references(() => users.id),
    /** The customer and vehicle as they were when the RO was written: later visits never rewrite them. */
    customerName: text('customer_name').notNull(),
    customerPhone: text('customer_phone'),
    customerEmail: text('customer_email'),
    vehicleYear: integer('vehicle_year').notNull(),
    vehicleMake: text('vehicle_make').notNull(),
    vehicleModel: text('vehicle_model').notNull(),
    vehiclePlate: text('vehicle_plate'),
    concern: text('concern').notNull(),
    odometer: integer('odometer').notNull(),
    status: text('status', { enum: REPAIR_ORDER_STATUSES }).notNull().default('open'),
    promisedAt: integer('promised_at', { mode: 'timestamp_ms' }),
    createdAt: integer('created_at', { mode: 'timestamp_ms' }).notNull(),
    closedAt: integer('closed_at', { mode: 'timestamp_ms' }),
    /** The RO's reference in the system it was imported from: one RO per reference in the shop. */
    externalRef: text('external_ref'),
  },
  (t) => [
    uniqueIndex('repair_orders_number_idx').on(t.number),
    uniqueIndex('repair_orders_external_ref_idx').on(t.externalRef),
    // The office list pages newest first, by status or not; the id (the rowid) breaks ties for free.
    index('repair_orders_status_created_at_idx').on(t.status, t.createdAt),
    index('repair_orders_created_at_idx').on(t.createdAt),
    index('repair_orders_advisor_id_created_at_idx').on(t.advisorId, t.createdAt),
    index('repair_orders_promised_at_idx').on(t.promisedAt),
    // A returning vehicle's last visit.
    index('repair_orders_vehicle_id_created_at_idx').on(t.vehicleId, t.createdAt),
    oneOf(t.status, REPAIR_ORDER_STATUSES),
  ],
);

export const jobLines = sqliteTable(
  'job_lines',
  {
    id: integer('id').primaryKey({ autoIncrement: true }),
    repairOrderId: integer('repair_order_id')
      .notNull()
      .references(() => repairOrders.id),
    lineNo: integer('line_no').notNull(),
    title: text('title').notNull(),
    bookHours: real('book_hours').notNull(),
    skillLevel: integer('skill_level').notNull().default(1),
    status: text('status', { enum: JOB_LINE_STATUSES }).notNull().default('queued'),
    holdReason: text('hold_reason', { enum: HOLD_REASONS }),
    heldAt: integer('held_at', { mode: 'timestamp_ms' }),
    priority: text('priority', { enum: PRIORITIES }).notNull().default('normal'),
    technicianId: integer('technician_id').references(() => users.id),
    bayId: integer('bay_id').references(() => bays.id),
    promisedAt: integer('promised_at', { mode: 'timestamp_ms' }),
    queuedAt: integer('queued_at', { mode: 'timestamp_ms' }).notNull(),
    completedAt: integer('completed_at', { mode: 'timestamp_ms' }),
    completedBy: integer('completed_by').references(() => users.id),
    /** The three Cs: the customer's concern (from intake), the cause found, the correction made. */
    concern: text('concern').notNull().default(''),
    cause: text('cause'),
    correction: text('correction'),
    cancelReason: text('cancel_reason'),
    updatedAt: integer('updated_at', { mode: 'timestamp_ms' }).notNull(),
    /** Done with less clocked time than the shop's minimum: out of the flagged figures until signed off. */
    signOff: text('sign_off', { enum: SIGN_OFF_STATES }),
    signedOffBy: integer('signed_off_by').references(() => users.id),
    signedOffAt: integer('signed_off_at', { mode: 'timestamp_ms' }),
    signOffReason: text('sign_off_reason'),
  },
  (t) => [
    uniqueIndex('job_lines_repair_order_line_no_idx').on(t.repairOrderId, t.lineNo),
    index('job_lines_technician_id_idx').on(t.technicianId),
    index('job_lines_bay_id_idx').on(t.bayId),
    index('job_lines_status_idx').on(t.status),
    // The floor reads only the lines still open: a small slice of years of finished work.
    index('job_lines_open_idx')
      .on(t.repairOrderId)
      .where(sql`${t.status} != 'done'`),
    index('job_lines_completed_at_idx').on(t.completedAt),
    // The reports' trend cache notices any changed line by the latest change.
    index('job_lines_updated_at_idx').on(t.updatedAt),
    oneOf(t.status, JOB_LINE_STATUSES),
    oneOf(t.holdReason, HOLD_REASONS),
    oneOf(t.priority, PRIORITIES),
  ],
);

/**
 * Finished lines changed: one row each time a line is finished, a finished line is edited, reopened or
 * removed, at the earlier of its completion instants before and after. Written by triggers on
 * `job_lines` (the `finished_line_changes` migration), which keep the latest thousand rows; the reports'
 * cache of past weeks reads the rows after the last one it saw and forgets the weeks from that instant.
 */
export const finishedLineChanges = sqliteTable('finished_line_changes', {
  seq: integer('seq').primaryKey({ autoIncrement: true }),
  at: integer('at', { mode: 'timestamp_ms' }).notNull(),
});
