import { Inject, Injectable } from '@nestjs/common';
import { desc, eq, inArray } from 'drizzle-orm';
import type { JobLineDto, RepairOrderStatus } from '@baytime/shared';
import { describeVehicle } from '../board/board.service.js';
import { DB, type Db } from '../db/database.js';
import { customers, jobLines, repairOrders, vehicles } from '../db/schema/index.js';
import { toJobLineDto } from './job-line.dto.js';

export interface RepairOrderSummary {
  id: number;
  number: string;
  customerName: string;
  vehicle: string;
  vin: string;
  odometer: number;
  concern: string;
  status: RepairOrderStatus;
  promisedAt: string | null;
  createdAt: string;
  lines: JobLineDto[];
}

@Injectable()
export class RepairOrdersService {
  constructor(@Inject(DB) private readonly db: Db) {}

  list(status?: RepairOrderStatus): RepairOrderSummary[] {
    const rows = this.db
      .select({ ro: repairOrders, customerName: customers.name, vehicle: vehicles })
      .from(repairOrders)
      .innerJoin(customers, eq(customers.id, repairOrders.customerId))
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .where(status ? eq(repairOrders.status, status) : undefined)
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
    return rows.map(({ ro, customerName, vehicle }) => ({
      id: ro.id,
      number: ro.number,
      customerName,
      vehicle: describeVehicle(vehicle),
      vin: vehicle.vin,
      odometer: ro.odometer,
      concern: ro.concern,
      status: ro.status,
      promisedAt: ro.promisedAt?.toISOString() ?? null,
      createdAt: ro.createdAt.toISOString(),
      lines: lines
        .filter((line) => line.repairOrderId === ro.id)
        .sort((a, b) => a.lineNo - b.lineNo)
        .map(toJobLineDto),
    }));
  }
}
