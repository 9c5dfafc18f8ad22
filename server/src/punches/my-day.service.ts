import { Inject, Injectable } from '@nestjs/common';
import { and, count, desc, eq, gte, inArray, or } from 'drizzle-orm';
import {
  ANSWERED_FINDINGS_HOURS,
  shopDayKey,
  shopLocalInstant,
  type MyDay,
  type TechnicianState,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { DB, type Db } from '../db/database.js';
import { lineIsDone } from '../db/line-is-done.js';
import { findings, jobLines } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { ShopService } from '../shop/shop.service.js';
import { receivedParts, waitingParts } from '../work/parts-hold.dto.js';

const OFF_SHIFT: TechnicianState = { status: 'off', since: null, breakKind: null, openJobLineIds: [] };

/** What a technician sees on the kiosk: where they stand and the lines that are theirs. */
@Injectable()
export class MyDayService {
  constructor(
    @Inject(DB) private readonly db: Db,
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
        concern: line.concern,
        parts: waitingParts(line) ?? receivedParts(line),
      })),
      doneToday: this.doneToday(technician.id, now, settings.timeZone),
      finalChecks: this.finalChecks(technician.id),
      answeredFindings: this.answeredFindings(
        lines.map((line) => line.id),
        now,
      ),
      idleSignOutSeconds: settings.kioskIdleSeconds,
      maxConcurrentJobs: settings.maxConcurrentJobs,
    };
  }

  private doneToday(technicianId: number, now: Date, timeZone: string): number {
    const midnight = shopLocalInstant(shopDayKey(now, timeZone), '00:00', timeZone);
    return (
      this.db
        .select({ n: count() })
        .from(jobLines)
        .where(
          and(
            gte(jobLines.completedAt, midnight),
            lineIsDone,
            or(eq(jobLines.completedBy, technicianId), eq(jobLines.technicianId, technicianId)),
          ),
        )
        .get()?.n ?? 0
    );
  }

  private answeredFindings(lineIds: number[], now: Date): MyDay['answeredFindings'] {
    if (!lineIds.length) return [];
    return this.db
      .select({
        findingId: findings.id,
        jobLineId: findings.jobLineId,
        note: findings.note,
        answer: findings.answer,
        answeredAt: findings.answeredAt,
      })
      .from(findings)
      .where(
        and(
          inArray(findings.jobLineId, lineIds),
          inArray(findings.answer, ['approved', 'declined']),
          gte(findings.answeredAt, new Date(now.getTime() - ANSWERED_FINDINGS_HOURS * 3600_000)),
        ),
      )
      .orderBy(desc(findings.answeredAt), desc(findings.id))
      .all()
      .flatMap(({ answer, answeredAt, ...finding }) =>
        answer !== 'pending' && answeredAt
          ? [{ ...finding, answer, answeredAt: answeredAt.toISOString() }]
          : [],
      );
  }

  /** Bays waiting for a final check on a vehicle this technician worked on. */
  private finalChecks(technicianId: number): MyDay['finalChecks'] {
    const waiting = this.floor.bays().filter((bay) => bay.phase === 'check' && bay.parked);
    if (!waiting.length) return [];
    const mine = new Set(
      this.db
        .selectDistinct({ repairOrderId: jobLines.repairOrderId })
        .from(jobLines)
        .where(
          and(
            inArray(
              jobLines.repairOrderId,
              waiting.map((bay) => bay.parked!.id),
            ),
            or(eq(jobLines.technicianId, technicianId), eq(jobLines.completedBy, technicianId)),
          ),
        )
        .all()
        .map((row) => row.repairOrderId),
    );
    return waiting
      .filter((bay) => mine.has(bay.parked!.id))
      .map((bay) => ({
        bayId: bay.id,
        bayName: bay.name,
        repairOrderNumber: bay.parked!.number,
        vehicle: bay.parked!.vehicle,
      }));
  }
}
