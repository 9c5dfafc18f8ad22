import { BadRequestException, Inject, Injectable } from '@nestjs/common';
import { and, count, desc, eq, gte, inArray, lt, sql, type SQL } from 'drizzle-orm';
import {
  shopDayKey,
  shopLocalInstant,
  type CreateRepairOrderBody,
  type RepairOrderListQuery,
  type RepairOrderPage,
  type RepairOrderSummary,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { LiveService } from '../live/live.service.js';
import { describeVehicle } from '../floor/describe-vehicle.js';
import { foundOrFail } from '../common/not-found.js';
import { decodeCursor, olderThan, toPage } from '../common/paging.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { customers, jobLines, repairOrders, users, vehicles } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { ShopService } from '../shop/shop.service.js';
import { toJobLineDto } from './job-line.dto.js';
import { waitingPartsOf } from './parts-hold.dto.js';
import { repairOrderSnapshot } from './repair-order-snapshot.js';
import { repairOrderSearch } from './repair-orders.search.js';

type CustomerRow = typeof customers.$inferSelect;
type VehicleRow = typeof vehicles.$inferSelect;

const DAY_MS = 24 * 3600_000;

function fieldError(path: string[], message: string, summary = message): BadRequestException {
  return new BadRequestException({ statusCode: 400, message: summary, issues: [{ path, message }] });
}

/** "Wendell  farrow" and "Wendell Farrow" are the same person at the counter. */
function sameName(a: string, b: string): boolean {
  const plain = (name: string) => name.trim().replace(/\s+/g, ' ').toLocaleLowerCase('en-US');
  return plain(a) === plain(b);
}

@Injectable()
export class RepairOrdersService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly labour: LabourService,
    private readonly floor: FloorService,
    private readonly shop: ShopService,
  ) {}

  /**
   * Writes a repair order: the vehicle is found by VIN or created, the lines join the queue. The RO
   * records the customer and vehicle as they are now; earlier ROs keep theirs. An odometer lower than
   * the last visit, or a VIN outside the 49 CFR 565 rules, needs a reason, which is audited. A promise
   * already past is refused.
   */
  @Transactional()
  create(body: CreateRepairOrderBody, actor: Principal, now = new Date()): RepairOrderSummary {
    const known = this.db.select().from(vehicles).where(eq(vehicles.vin, body.vehicle.vin)).get();
    const lastOdometer = known?.lastOdometer ?? null;
    if (lastOdometer !== null && body.vehicle.odometer < lastOdometer && !body.odometerOverrideReason) {
      const reading = lastOdometer.toLocaleString('en-US');
      throw fieldError(
        ['vehicle', 'odometer'],
        `Lower than the last visit (${reading}): check it, or give a reason to save anyway`,
        `The odometer reads less than at the last visit (${reading})`,
      );
    }
    const promisedAt = body.promisedAt ? new Date(body.promisedAt) : null;
    if (promisedAt && promisedAt <= now)
      throw fieldError(['promisedAt'], 'That time has already passed: promise a later one');

    const owner = this.ownerFor(known, body.customer, now);
    const vehicle = this.upsertVehicle(known, body, owner.id);
    const last = this.db
      .select({ number: sql<number | null>`max(cast(${repairOrders.number} as integer))` })
      .from(repairOrders)
      .get()?.number;
    const ro = this.db
      .insert(repairOrders)
      .values({
        number: String(Math.max(4400, Number(last ?? 0)) + 1),
        customerId: owner.id,
        vehicleId: vehicle.id,
        ...repairOrderSnapshot(owner, vehicle),
        advisorId: actor.id,
        concern: body.concern,
        odometer: body.vehicle.odometer,
        promisedAt,
        createdAt: now,
      })
      .returning()
      .get();
    body.lines.forEach((line, i) =>
      this.db
        .insert(jobLines)
        .values({ ...line, repairOrderId: ro.id, lineNo: i + 1, promisedAt, queuedAt: now, updatedAt: now })
        .run(),
    );
    const detail = {
      ...(body.odometerOverrideReason && {
        odometerOverrideReason: body.odometerOverrideReason,
        lastOdometer,
      }),
      ...(body.vinOverrideReason && { vinOverrideReason: body.vinOverrideReason }),
      ...(known && known.customerId !== owner.id && { previousCustomerId: known.customerId }),
    };
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'repair-order',
      entityId: ro.id,
      detail: Object.keys(detail).length ? detail : undefined,
    });
    const created = this.get(ro.id, now);
    for (const jobLine of created.lines) this.live.publish('job-line.updated', { jobLine });
    this.floor.linesChanged(created.lines.map((line) => line.id));
    return created;
  }

  get(id: number, now = new Date()): RepairOrderSummary {
    return foundOrFail(this.summaries(this.rows(eq(repairOrders.id, id), 1), now)[0], 'Repair order');
  }

  /** One page, newest first; clocked time is counted for the lines on this page only. */
  list(query: RepairOrderListQuery, now = new Date()): RepairOrderPage {
    const where = and(
      query.status ? eq(repairOrders.status, query.status) : undefined,
      query.advisorId ? eq(repairOrders.advisorId, query.advisorId) : undefined,
      query.promised === 'today' ? this.promisedToday(now) : undefined,
      query.late ? and(eq(repairOrders.status, 'open'), lt(repairOrders.promisedAt, now)) : undefined,
      query.q ? repairOrderSearch(query.q) : undefined,
    );
    const total = this.db.select({ n: count() }).from(repairOrders).where(where).get()?.n ?? 0;
    const after = olderThan(repairOrders.createdAt, repairOrders.id, decodeCursor(query.cursor));
    return toPage(
      this.rows(and(where, after), query.limit + 1),
      query.limit,
      total,
      ({ ro }) => ({ at: ro.createdAt.getTime(), id: ro.id }),
      (shown) => this.summaries(shown, now),
    );
  }

  /** The shop's today, midnight to midnight in its time zone. */
  private promisedToday(now: Date): SQL | undefined {
    const { timeZone } = this.shop.settings();
    const today = shopDayKey(now, timeZone);
    const tomorrow = shopDayKey(
      new Date(shopLocalInstant(today, '12:00', timeZone).getTime() + DAY_MS),
      timeZone,
    );
    return and(
      gte(repairOrders.promisedAt, shopLocalInstant(today, '00:00', timeZone)),
      lt(repairOrders.promisedAt, shopLocalInstant(tomorrow, '00:00', timeZone)),
    );
  }

  /**
   * The customer to link: the vehicle's owner when the name is theirs (their contact brought up to
   * date), otherwise a new customer: a vehicle that changed hands, or one the shop has never seen.
   */
  private ownerFor(
    known: VehicleRow | undefined,
    given: CreateRepairOrderBody['customer'],
    now: Date,
  ): CustomerRow {
    const phone = given.phone ?? null;
    const email = given.email?.toLowerCase() ?? null;
    const current = known && this.db.select().from(customers).where(eq(customers.id, known.customerId)).get();
    if (current && sameName(current.name, given.name))
      return this.db
        .update(customers)
        .set({ name: given.name, phone: phone ?? current.phone, email: email ?? current.email })
        .where(eq(customers.id, current.id))
        .returning()
        .get()!;
    return this.db
      .insert(customers)
      .values({ name: given.name, phone, email, createdAt: now })
      .returning()
      .get();
  }

  /** The vehicle as it is today; the odometer only ever rises. */
  private upsertVehicle(
    known: VehicleRow | undefined,
    body: CreateRepairOrderBody,
    ownerId: number,
  ): VehicleRow {
    const { vin, year, make, model, plate, odometer } = body.vehicle;
    const details = {
      customerId: ownerId,
      year,
      make,
      model,
      plate: plate ?? null,
      lastOdometer: Math.max(odometer, known?.lastOdometer ?? 0),
    };
    return known
      ? this.db.update(vehicles).set(details).where(eq(vehicles.id, known.id)).returning().get()!
      : this.db
          .insert(vehicles)
          .values({ ...details, vin })
          .returning()
          .get();
  }

  private rows(where: SQL | undefined, limit: number) {
    return this.db
      .select({ ro: repairOrders, vin: vehicles.vin, advisorName: users.name })
      .from(repairOrders)
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .leftJoin(users, eq(users.id, repairOrders.advisorId))
      .where(where)
      .orderBy(desc(repairOrders.createdAt), desc(repairOrders.id))
      .limit(limit)
      .all();
  }

  /** The rows with their lines; clocked time is counted for these lines only. */
  private summaries(rows: ReturnType<RepairOrdersService['rows']>, now: Date): RepairOrderSummary[] {
    const lines = rows.length
      ? this.db
          .select()
          .from(jobLines)
          .where(
            inArray(
              jobLines.repairOrderId,
              rows.map(({ ro }) => ro.id),
            ),
          )
          .all()
      : [];
    const seconds = this.labour.lineSeconds(
      lines.map((line) => line.id),
      now,
    );
    return rows.map(({ ro, vin, advisorName }) => ({
      id: ro.id,
      number: ro.number,
      customerName: ro.customerName,
      customerPhone: ro.customerPhone,
      customerEmail: ro.customerEmail,
      vehicle: describeVehicle({ year: ro.vehicleYear, make: ro.vehicleMake, model: ro.vehicleModel }),
      vin,
      plate: ro.vehiclePlate,
      advisorId: ro.advisorId,
      advisorName,
      odometer: ro.odometer,
      concern: ro.concern,
      status: ro.status,
      promisedAt: ro.promisedAt?.toISOString() ?? null,
      createdAt: ro.createdAt.toISOString(),
      lines: lines
        .filter((line) => line.repairOrderId === ro.id)
        .sort((a, b) => a.lineNo - b.lineNo)
        .map((line) => ({
          ...toJobLineDto(line),
          clockedSeconds: Math.round(seconds.get(line.id)?.total ?? 0),
          parts: waitingPartsOf(this.floor.openLine(line.id)),
        })),
    }));
  }
}
