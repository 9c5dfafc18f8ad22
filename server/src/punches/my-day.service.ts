import { Inject, Injectable } from '@nestjs/common';
import { asc, eq, inArray, ne, or, and } from 'drizzle-orm';
import { technicianState, type MyDay } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { describeVehicle } from '../board/board.service.js';
import { DB, type Db } from '../db/database.js';
import { bays, jobLines, repairOrders, vehicles } from '../db/schema/index.js';
import { LabourService } from '../labour/labour.service.js';
import { ShopService } from '../shop/shop.service.js';

/** What a technician sees on the kiosk: where they stand and the lines that are theirs. */
@Injectable()
export class MyDayService {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly labour: LabourService,
    private readonly shop: ShopService,
  ) {}

  get(technician: Principal, now = new Date()): MyDay {
    const settings = this.shop.settings();
    const state = technicianState(this.labour.currentLedger(technician.id, now));
    const lineFilter = state.openJobLineIds.length
      ? or(eq(jobLines.technicianId, technician.id), inArray(jobLines.id, state.openJobLineIds))
      : eq(jobLines.technicianId, technician.id);
    const rows = this.db
      .select({ line: jobLines, number: repairOrders.number, vehicle: vehicles, bayName: bays.name })
      .from(jobLines)
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .innerJoin(vehicles, eq(vehicles.id, repairOrders.vehicleId))
      .leftJoin(bays, eq(bays.id, jobLines.bayId))
      .where(and(lineFilter, ne(jobLines.status, 'done')))
      .orderBy(asc(jobLines.queuedAt), asc(jobLines.id))
      .all();
    const seconds = this.labour.lineSeconds(
      rows.map(({ line }) => line.id),
      now,
    );
    return {
      serverTime: now.toISOString(),
      technician: { id: technician.id, name: technician.name },
      shift: { status: state.status, since: state.since?.toISOString() ?? null, breakKind: state.breakKind },
      openJobLineIds: state.openJobLineIds,
      lines: rows.map(({ line, number, vehicle, bayName }) => ({
        id: line.id,
        repairOrderNumber: number,
        vehicle: describeVehicle(vehicle),
        title: line.title,
        lineNo: line.lineNo,
        bookHours: line.bookHours,
        mySeconds: Math.round(seconds.get(line.id)?.byTechnician.get(technician.id) ?? 0),
        allSeconds: Math.round(seconds.get(line.id)?.total ?? 0),
        status: line.status,
        holdReason: line.holdReason,
        priority: line.priority,
        bayName,
        clockedOn: state.openJobLineIds.includes(line.id),
      })),
      idleSignOutSeconds: settings.kioskIdleSeconds,
      maxConcurrentJobs: settings.maxConcurrentJobs,
    };
  }
}
