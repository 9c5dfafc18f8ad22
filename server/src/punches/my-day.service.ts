import { Injectable } from '@nestjs/common';
import type { MyDay, TechnicianState } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { FloorService } from '../floor/floor.service.js';
import { ShopService } from '../shop/shop.service.js';
import { receivedParts, waitingParts } from '../work/parts-hold.dto.js';

const OFF_SHIFT: TechnicianState = { status: 'off', since: null, breakKind: null, openJobLineIds: [] };

/** What a technician sees on the kiosk: where they stand and the lines that are theirs. */
@Injectable()
export class MyDayService {
  constructor(
    private readonly floor: FloorService,
    private readonly shop: ShopService,
  ) {}

  get(technician: Principal, now = new Date()): MyDay {
    const settings = this.shop.settings();
    const state = this.floor.stateOf(technician.id, now) ?? OFF_SHIFT;
    const seconds = this.floor.lineSeconds(now);
    const bayNames = new Map(this.floor.bays().map((bay) => [bay.id, bay.name]));
    const lines = this.floor
      .openLines()
      .filter((line) => line.technicianId === technician.id || state.openJobLineIds.includes(line.id))
      .sort((a, b) => a.queuedAt.getTime() - b.queuedAt.getTime() || a.id - b.id);
    return {
      serverTime: now.toISOString(),
      technician: { id: technician.id, name: technician.name },
      shift: { status: state.status, since: state.since?.toISOString() ?? null, breakKind: state.breakKind },
      openJobLineIds: [...state.openJobLineIds],
      lines: lines.map((line) => ({
        id: line.id,
        repairOrderNumber: line.repairOrderNumber,
        vehicle: line.vehicle,
        title: line.title,
        lineNo: line.lineNo,
        bookHours: line.bookHours,
        mySeconds: Math.round(seconds.get(line.id)?.byTechnician.get(technician.id) ?? 0),
        allSeconds: Math.round(seconds.get(line.id)?.total ?? 0),
        status: line.status,
        holdReason: line.holdReason,
        priority: line.priority,
        bayName: line.bayId ? (bayNames.get(line.bayId) ?? null) : null,
        clockedOn: state.openJobLineIds.includes(line.id),
        parts: waitingParts(line) ?? receivedParts(line),
      })),
      idleSignOutSeconds: settings.kioskIdleSeconds,
      maxConcurrentJobs: settings.maxConcurrentJobs,
    };
  }
}
