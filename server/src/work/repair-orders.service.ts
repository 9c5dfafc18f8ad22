import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { and, count, desc, eq, gt, gte, inArray, isNull, lt, max, sql, type SQL } from 'drizzle-orm';
import {
  isOpenLine,
  shopDayKey,
  shopLocalInstant,
  type AddJobLineBody,
  type CreateRepairOrderBody,
  type EditRepairOrderBody,
  type JobLineDto,
  type LineOrderBody,
  type RepairOrderHistoryEntry,
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
import {
  approvalLinks,
  bays,
  customers,
  jobLines,
  repairOrders,
  timers,
  users,
  vehicles,
} from '../db/schema/index.js';
import { DispatchService } from '../dispatch/dispatch.service.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { ShopService } from '../shop/shop.service.js';
import { toJobLineDto } from './job-line.dto.js';
import { changedFields, JobLinesService } from './job-lines.service.js';
import { repairOrderHistory } from './repair-order-history.js';
import { waitingPartsOf } from './parts-hold.dto.js';
import { repairOrderSnapshot } from './repair-order-snapshot.js';
import { syncRepairOrderStatus } from './repair-order-status.js';
import { repairOrderSearch, repairOrderSearchCount } from './repair-orders.search.js';

type CustomerRow = typeof customers.$inferSelect;
type VehicleRow = typeof vehicles.$inferSelect;

const DAY_MS = 24 * 3600_000;
/** Reading a matched RO and sorting it in, against stepping over one index entry: measured, roughly. */
const READ_AND_SORT_COST = 10;

type RepairOrderDetails = Pick<EditRepairOrderBody, 'customer' | 'vehicle' | 'concern' | 'promisedAt'>;

/** An edit's fields, or what its editor read, as the RO row's columns. */
function asRow({ customer = {}, vehicle = {}, concern, promisedAt }: RepairOrderDetails) {
  return {
    customerName: customer.name,
    customerPhone: customer.phone,
    customerEmail: customer.email === null ? null : customer.email?.toLowerCase(),
    vehicleYear: vehicle.year,
    vehicleMake: vehicle.make,
    vehicleModel: vehicle.model,
    vehiclePlate: vehicle.plate,
    odometer: vehicle.odometer,
    concern,
    promisedAt: promisedAt === undefined ? undefined : promisedAt === null ? null : new Date(promisedAt),
  };
}

/** The RO's fields in words, for a conflict that names what someone else changed. */
const RO_FIELD_WORDS = {
  customerName: 'customer’s name',
  customerPhone: 'phone',
  customerEmail: 'e-mail',
  vehicleYear: 'year',
  vehicleMake: 'make',
  vehicleModel: 'model',
  vehiclePlate: 'plate',
  odometer: 'odometer reading',
  concern: 'concern',
  promisedAt: 'promise time',
} satisfies Record<keyof ReturnType<typeof asRow>, string>;

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
    private readonly dispatch: DispatchService,
    private readonly lines: JobLinesService,
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
        // An RO sent by another system has no advisor until one takes it.
        advisorId: actor.integrationKey ? null : actor.id,
        concern: body.concern,
        externalRef: body.externalRef ?? null,
        odometer: body.vehicle.odometer,
        promisedAt,
        createdAt: now,
      })
      .returning()
      .get();
    body.lines.forEach((line, i) =>
      this.db
        .insert(jobLines)
        .values({
          ...line,
          concern: line.concern ?? body.concern,
          repairOrderId: ro.id,
          lineNo: i + 1,
          promisedAt,
          queuedAt: now,
          updatedAt: now,
        })
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
    for (const jobLine of created.lines)
      this.live.publish('job-line.updated', { jobLine }, this.floor.lineAudience(jobLine));
    this.floor.linesChanged(created.lines.map((line) => line.id));
    return created;
  }

  /** `create`, unless an RO with the body's `externalRef` is already written: then that one, unchanged. */
  @Transactional()
  createOnce(
    body: CreateRepairOrderBody,
    actor: Principal,
    now = new Date(),
  ): { repairOrder: RepairOrderSummary; replayed: boolean } {
    const known =
      body.externalRef &&
      this.db
        .select({ id: repairOrders.id })
        .from(repairOrders)
        .where(eq(repairOrders.externalRef, body.externalRef))
        .get();
    return known
      ? { repairOrder: this.get(known.id, now), replayed: true }
      : { repairOrder: this.create(body, actor, now), replayed: false };
  }

  get(id: number, now = new Date()): RepairOrderSummary {
    return foundOrFail(this.summaries(this.rows(eq(repairOrders.id, id), 1), now)[0], 'Repair order');
  }

  /** One page, newest first; clocked time is counted for the lines on this page only. */
  list(query: RepairOrderListQuery, now = new Date()): RepairOrderPage {
    const filters = and(
      query.status ? eq(repairOrders.status, query.status) : undefined,
      query.advisorId ? eq(repairOrders.advisorId, query.advisorId) : undefined,
      query.promised === 'today' ? this.promisedToday(now) : undefined,
      query.late ? inArray(repairOrders.id, [...this.lateWork(now).repairOrderIds]) : undefined,
    );
    const where = (newestFirst: boolean) =>
      and(filters, query.q ? repairOrderSearch(query.q, newestFirst) : undefined);
    // A search alone is counted in the search table, without reading an RO.
    const total =
      query.q && !filters
        ? repairOrderSearchCount(this.db, query.q)
        : (this.db.select({ n: count() }).from(repairOrders).where(where(false)).get()?.n ?? 0);
    const after = olderThan(repairOrders.createdAt, repairOrders.id, decodeCursor(query.cursor));
    return toPage(
      this.rows(
        and(where(query.q !== undefined && this.walkNewestFirst(total, query.limit)), after),
        query.limit + 1,
      ),
      query.limit,
      total,
      ({ ro }) => ({ at: ro.createdAt.getTime(), id: ro.id }),
      (shown) => this.summaries(shown, now),
    );
  }

  /**
   * Whether a page of `limit` out of `matches` ROs is found sooner by walking all ROs newest first, about
   * (all ÷ matches) × limit index entries, than by reading and sorting every match. The highest RO id
   * stands for the count of all: ids are given in turn.
   */
  private walkNewestFirst(matches: number, limit: number): boolean {
    const all =
      this.db
        .select({ n: max(repairOrders.id) })
        .from(repairOrders)
        .get()?.n ?? 0;
    return matches * matches * READ_AND_SORT_COST > all * (limit + 1);
  }

  /**
   * Corrections after the fact, while the RO is open: the RO's own record of the customer and vehicle
   * (and the customer and vehicle on file, so the next visit starts right), the concern and the
   * promise. Audited with what each field was. A reading lowered below the vehicle's highest needs a
   * reason, as at intake, and the vehicle's reading never goes down.
   */
  @Transactional()
  edit(id: number, body: EditRepairOrderBody, actor: Principal, now = new Date()): RepairOrderSummary {
    const ro = this.openRow(id);
    const moved = Object.keys(changedFields(ro, asRow(body.was ?? {}))).map(
      (field) => RO_FIELD_WORDS[field as keyof typeof RO_FIELD_WORDS],
    );
    if (moved.length > 0)
      throw new ConflictException(
        `Someone else changed the ${moved.join(' and the ')} of RO ${ro.number} since you opened it: reload to see their change`,
      );
    const edited = asRow(body);
    const { promisedAt } = edited;
    if (promisedAt && promisedAt <= now && promisedAt.getTime() !== ro.promisedAt?.getTime())
      throw fieldError(['promisedAt'], 'That time has already passed: promise a later one');
    const { customer = {}, vehicle = {} } = body;
    const email = edited.customerEmail;
    const changes = changedFields(ro, edited);
    if (Object.keys(changes).length === 0) return this.get(id, now);
    const { odometer, ...details } = vehicle;
    const reading = odometer !== ro.odometer ? odometer : undefined;
    const lastOdometer = reading === undefined ? null : this.lastOdometer(ro.vehicleId);
    // Raising an older RO's reading towards a later visit's rolls nothing back; lowering one does.
    if (
      reading !== undefined &&
      lastOdometer !== null &&
      reading < Math.min(ro.odometer, lastOdometer) &&
      !body.odometerOverrideReason
    ) {
      const highest = lastOdometer.toLocaleString('en-US');
      throw fieldError(
        ['vehicle', 'odometer'],
        `Lower than the highest reading on record (${highest}): check it, or give a reason to save anyway`,
        `The odometer reads less than the highest reading on record (${highest})`,
      );
    }
    const set = Object.fromEntries(Object.entries(changes).map(([key, { to }]) => [key, to]));
    this.db.update(repairOrders).set(set).where(eq(repairOrders.id, id)).run();
    const onFile = { name: customer.name, phone: customer.phone, email };
    if (Object.values(onFile).some((v) => v !== undefined))
      this.db.update(customers).set(onFile).where(eq(customers.id, ro.customerId)).run();
    if (Object.values(details).some((v) => v !== undefined) || reading !== undefined)
      this.db
        .update(vehicles)
        .set({
          ...details,
          ...(reading !== undefined && { lastOdometer: Math.max(reading, lastOdometer ?? 0) }),
        })
        .where(eq(vehicles.id, ro.vehicleId))
        .run();
    if (promisedAt !== undefined)
      this.db
        .update(jobLines)
        .set({ promisedAt, updatedAt: now })
        .where(eq(jobLines.repairOrderId, id))
        .run();
    this.audit.record({
      actorId: actor.id,
      action: 'edit',
      entity: 'repair-order',
      entityId: id,
      detail: {
        changes,
        ...(reading !== undefined &&
          body.odometerOverrideReason && {
            odometerOverrideReason: body.odometerOverrideReason,
            lastOdometer,
          }),
      },
    });
    // The floor reads the RO's record of the vehicle (the wall's tiles, the kiosks' lines and final
    // checks) and the lines' promise: it reads this RO's lines and bays again, and only those.
    this.floor.repairOrdersChanged([id]);
    return this.changed(id, [], now);
  }

  /** A line added after the RO was written joins the queue; a finished RO is open again. */
  @Transactional()
  addLine(id: number, body: AddJobLineBody, actor: Principal, now = new Date()): JobLineDto {
    const ro = this.openRow(id);
    const last = this.db
      .select({ lineNo: max(jobLines.lineNo) })
      .from(jobLines)
      .where(eq(jobLines.repairOrderId, id))
      .get()?.lineNo;
    const line = this.db
      .insert(jobLines)
      .values({
        ...body,
        concern: body.concern ?? ro.concern,
        repairOrderId: id,
        lineNo: (last ?? 0) + 1,
        promisedAt: ro.promisedAt,
        queuedAt: now,
        updatedAt: now,
      })
      .returning()
      .get();
    syncRepairOrderStatus(this.db, id);
    this.audit.record({
      actorId: actor.id,
      action: 'line-added',
      entity: 'repair-order',
      entityId: id,
      detail: { jobLineId: line.id, lineNo: line.lineNo, title: line.title, bookHours: line.bookHours },
    });
    const jobLine = toJobLineDto(line);
    this.live.publish('job-line.updated', { jobLine }, this.floor.lineAudience(jobLine));
    this.changed(id, [line.id], now);
    return jobLine;
  }

  /** The RO's lines in a new order: every line, each once. */
  @Transactional()
  reorderLines(
    id: number,
    { lineIds }: LineOrderBody,
    actor: Principal,
    now = new Date(),
  ): RepairOrderSummary {
    this.openRow(id);
    const current = this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(eq(jobLines.repairOrderId, id))
      .all()
      .map((line) => line.id);
    if (
      lineIds.length !== current.length ||
      new Set(lineIds).size !== lineIds.length ||
      !lineIds.every((l) => current.includes(l))
    )
      throw fieldError(['lineIds'], 'Give every line of this repair order once');
    this.lines.renumber(lineIds, now);
    this.audit.record({
      actorId: actor.id,
      action: 'lines-reordered',
      entity: 'repair-order',
      entityId: id,
      detail: { lineIds },
    });
    return this.changed(id, lineIds, now);
  }

  /**
   * The vehicle is picked up: the RO closes, any bay still holding it is free, its timers stop and its
   * approval links still open are withdrawn. Only once every line is done or cancelled.
   */
  @Transactional()
  close(id: number, actor: Principal, now = new Date()): RepairOrderSummary {
    const ro = this.row(id);
    if (ro.status === 'closed') throw new ConflictException(`RO ${ro.number} is already closed`);
    if (syncRepairOrderStatus(this.db, id) !== 'done')
      throw new ConflictException(`RO ${ro.number} still has open work: finish or cancel its lines first`);
    this.db
      .update(repairOrders)
      .set({ status: 'closed', closedAt: now })
      .where(eq(repairOrders.id, id))
      .run();
    const freed = this.db
      .update(bays)
      .set({ phase: 'free', phaseSince: now, repairOrderId: null })
      .where(eq(bays.repairOrderId, id))
      .returning({ id: bays.id, name: bays.name })
      .all();
    const stopped = this.db
      .update(timers)
      .set({ endedAt: now })
      .where(
        and(
          isNull(timers.endedAt),
          inArray(
            timers.jobLineId,
            this.db.select({ id: jobLines.id }).from(jobLines).where(eq(jobLines.repairOrderId, id)),
          ),
        ),
      )
      .returning({ id: timers.id, bayId: timers.bayId })
      .all();
    const withdrawn = this.db
      .update(approvalLinks)
      .set({ revokedAt: now, revokedBy: actor.id })
      .where(
        and(
          eq(approvalLinks.repairOrderId, id),
          isNull(approvalLinks.usedAt),
          isNull(approvalLinks.revokedAt),
          gt(approvalLinks.expiresAt, now),
        ),
      )
      .returning({ id: approvalLinks.id })
      .all();
    this.audit.record({
      actorId: actor.id,
      action: 'close',
      entity: 'repair-order',
      entityId: id,
      detail: {
        bays: freed.map((bay) => bay.name),
        timers: stopped.map((timer) => timer.id),
        approvalLinks: withdrawn.map((link) => link.id),
      },
    });
    for (const timer of stopped)
      this.live.publish('timer.updated', { timerId: timer.id, bayId: timer.bayId }, { to: 'everyone' });
    this.floor.baysChanged();
    if (stopped.length) this.floor.timersChanged();
    return this.changed(id, [], now);
  }

  history(id: number): RepairOrderHistoryEntry[] {
    this.row(id);
    return repairOrderHistory(this.db, id);
  }

  /** Tells the floor and the office pages; answers the RO as it is now. */
  private changed(id: number, lineIds: number[], now: Date): RepairOrderSummary {
    this.live.publish('repair-order.updated', { repairOrderId: id });
    this.floor.linesChanged(lineIds);
    return this.get(id, now);
  }

  private row(id: number): typeof repairOrders.$inferSelect {
    return foundOrFail(
      this.db.select().from(repairOrders).where(eq(repairOrders.id, id)).get(),
      'Repair order',
    );
  }

  /** The vehicle's highest reading on record: intake and edits only ever raise it. */
  private lastOdometer(vehicleId: number): number | null {
    return (
      this.db
        .select({ reading: vehicles.lastOdometer })
        .from(vehicles)
        .where(eq(vehicles.id, vehicleId))
        .get()?.reading ?? null
    );
  }

  private openRow(id: number): typeof repairOrders.$inferSelect {
    const ro = this.row(id);
    if (ro.status === 'closed')
      throw new ConflictException(`RO ${ro.number} is closed: open a new one for more work`);
    return ro;
  }

  /** Late lines by the one definition dispatch counts, and the ROs they are on. */
  private lateWork(now: Date): { lineIds: Set<number>; repairOrderIds: Set<number> } {
    const late = this.dispatch.lateLines(now);
    return {
      lineIds: new Set(late.map((line) => line.id)),
      repairOrderIds: new Set(late.map((line) => line.repairOrderId)),
    };
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

  /** The vehicle as it is today; a plate left out stays as on file; the odometer only ever rises. */
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
      plate: plate ?? known?.plate ?? null,
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
    const late = lines.some(isOpenLine) ? this.lateWork(now).lineIds : new Set<number>();
    return rows.map(({ ro, vin, advisorName }) => ({
      id: ro.id,
      number: ro.number,
      customerName: ro.customerName,
      customerPhone: ro.customerPhone,
      customerEmail: ro.customerEmail,
      vehicle: describeVehicle({ year: ro.vehicleYear, make: ro.vehicleMake, model: ro.vehicleModel }),
      vehicleYear: ro.vehicleYear,
      vehicleMake: ro.vehicleMake,
      vehicleModel: ro.vehicleModel,
      vin,
      plate: ro.vehiclePlate,
      advisorId: ro.advisorId,
      advisorName,
      odometer: ro.odometer,
      concern: ro.concern,
      status: ro.status,
      externalRef: ro.externalRef,
      promisedAt: ro.promisedAt?.toISOString() ?? null,
      createdAt: ro.createdAt.toISOString(),
      closedAt: ro.closedAt?.toISOString() ?? null,
      late: lines.some((line) => line.repairOrderId === ro.id && late.has(line.id)),
      lines: lines
        .filter((line) => line.repairOrderId === ro.id)
        .sort((a, b) => a.lineNo - b.lineNo)
        .map((line) => ({
          ...toJobLineDto(line),
          clockedSeconds: Math.round(seconds.get(line.id)?.total ?? 0),
          late: late.has(line.id),
          parts: waitingPartsOf(this.floor.openLine(line.id)),
        })),
    }));
  }
}
