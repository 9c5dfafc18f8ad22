import { BadRequestException, Inject, Injectable } from '@nestjs/common';
import { desc, eq, inArray, sql } from 'drizzle-orm';
import type { CreateRepairOrderBody, RepairOrderStatus, RepairOrderSummary } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { LiveService } from '../live/live.service.js';
import { describeVehicle } from '../floor/describe-vehicle.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { customers, jobLines, repairOrders, users, vehicles } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { toJobLineDto } from './job-line.dto.js';

@Injectable()
export class RepairOrdersService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly labour: LabourService,
    private readonly floor: FloorService,
  ) {}

  /**
   * Writes a repair order: the vehicle is found by VIN (its customer updated) or created, the lines
   * join the queue. An odometer lower than the last visit is refused at the field unless a reason is
   * given, which is audited.
   */
  @Transactional()
  create(body: CreateRepairOrderBody, actor: Principal, now = new Date()): RepairOrderSummary {
    const { customer, vehicle, concern, lines } = body;
    const known = this.db.select().from(vehicles).where(eq(vehicles.vin, vehicle.vin)).get();
    const lastOdometer = known?.lastOdometer ?? null;
    if (lastOdometer !== null && vehicle.odometer < lastOdometer && !body.odometerOverrideReason)
      throw new BadRequestException({
        statusCode: 400,
        message: `The odometer reads less than at the last visit (${lastOdometer.toLocaleString('en-US')})`,
        issues: [
          {
            path: ['vehicle', 'odometer'],
            message: `Lower than the last visit (${lastOdometer.toLocaleString('en-US')}): check it, or give a reason to save anyway`,
          },
        ],
      });
    const promisedAt = body.promisedAt ? new Date(body.promisedAt) : null;
    const id = this.db.transaction((tx) => {
      const contact = {
        name: customer.name,
        phone: customer.phone ?? null,
        email: customer.email?.toLowerCase() ?? null,
      };
      const customerId = known
        ? tx.update(customers).set(contact).where(eq(customers.id, known.customerId)).returning().get().id
        : tx
            .insert(customers)
            .values({ ...contact, createdAt: now })
            .returning()
            .get().id;
      const details = {
        year: vehicle.year,
        make: vehicle.make,
        model: vehicle.model,
        plate: vehicle.plate ?? null,
        lastOdometer: Math.max(vehicle.odometer, lastOdometer ?? 0),
      };
      const vehicleId = known
        ? tx.update(vehicles).set(details).where(eq(vehicles.id, known.id)).returning().get().id
        : tx
            .insert(vehicles)
            .values({ ...details, customerId, vin: vehicle.vin })
            .returning()
            .get().id;
      const last = tx
        .select({ number: sql<number | null>`max(cast(${repairOrders.number} as integer))` })
        .from(repairOrders)
        .get()?.number;
      const ro = tx
        .insert(repairOrders)
        .values({
          number: String(Math.max(4400, Number(last ?? 0)) + 1),
          customerId,
          vehicleId,
          advisorId: actor.id,
          concern,
          odometer: vehicle.odometer,
          promisedAt,
          createdAt: now,
        })
        .returning()
        .get();
      lines.forEach((line, i) =>
        tx
          .insert(jobLines)
          .values({ ...line, repairOrderId: ro.id, lineNo: i + 1, promisedAt, queuedAt: now, updatedAt: now })
          .run(),
      );
      return ro.id;
    });
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'repair-order',
      entityId: id,
      detail: body.odometerOverrideReason
        ? { odometerOverrideReason: body.odometerOverrideReason, lastOdometer }
        : undefined,
    });
    const created = this.get(id);
    for (const jobLine of created.lines) this.live.publish('job-line.updated', { jobLine });
    this.floor.linesChanged(created.lines.map((line) => line.id));
    return created;
  }

  get(id: number): RepairOrderSummary {
    return foundOrFail(this.list(undefined, id)[0], 'Repair order');
  }

  list(status?: RepairOrderStatus, id?: number): RepairOrderSummary[] {
    const rows = this.db
      .select({ ro: repairOrders, customer: customers, vehicle: vehicles, advisorName: users.name })
      .from(repairOrders)
      .innerJoin(customers, eq(customers.id, repairOrders.customerId))
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .leftJoin(users, eq(users.id, repairOrders.advisorId))
      .where(id ? eq(repairOrders.id, id) : status ? eq(repairOrders.status, status) : undefined)
      .orderBy(desc(repairOrders.createdAt))
      .all();
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
      new Date(),
    );
    return rows.map(({ ro, customer, vehicle, advisorName }) => ({
      id: ro.id,
      number: ro.number,
      customerName: customer.name,
      customerPhone: customer.phone,
      customerEmail: customer.email,
      vehicle: describeVehicle(vehicle),
      vin: vehicle.vin,
      plate: vehicle.plate,
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
        })),
    }));
  }
}
