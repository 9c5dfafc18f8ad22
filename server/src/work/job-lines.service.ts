import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Inject,
  Injectable,
} from '@nestjs/common';
import { and, eq, ne } from 'drizzle-orm';
import type {
  FinishLineBody,
  HoldLineBody,
  JobLineDto,
  PatchJobLineBody,
  ResolutionBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { bays, jobLines, repairOrders, users } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { LiveService } from '../live/live.service.js';
import { ClosedWeeksService } from '../payroll/closed-weeks.service.js';
import { PunchesService } from '../punches/punches.service.js';
import { ShopService } from '../shop/shop.service.js';
import { toJobLineDto } from './job-line.dto.js';

type LineRow = typeof jobLines.$inferSelect;

/** Changes to job lines: the foreman's dispatch, and a technician's hold and done from the kiosk. */
@Injectable()
export class JobLinesService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly floor: FloorService,
    private readonly punches: PunchesService,
    private readonly closedWeeks: ClosedWeeksService,
    private readonly shop: ShopService,
    private readonly labour: LabourService,
  ) {}

  @Transactional()
  patch(id: number, body: PatchJobLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.find(id);
    if (body.technicianId) this.assertTechnician(body.technicianId);
    if (body.bayId)
      foundOrFail(
        this.db
          .select()
          .from(bays)
          .where(and(eq(bays.id, body.bayId), eq(bays.active, true)))
          .get(),
        'Bay',
      );
    if (body.completedAt && new Date(body.completedAt) > now)
      throw new BadRequestException('A line cannot be finished in the future');
    if (body.completedAt) this.closedWeeks.assertOpenAt(new Date(body.completedAt), 'That completion time');
    else if (body.status === 'done' && line.status !== 'done')
      this.closedWeeks.assertOpenAt(now, 'Finishing that line');

    const changes: Partial<typeof jobLines.$inferInsert> = { updatedAt: now };
    if (body.priority) changes.priority = body.priority;
    if (body.technicianId !== undefined && body.technicianId !== line.technicianId) {
      changes.technicianId = body.technicianId;
      const moved = this.punches.clockOffLine(id, actor, 'Line reassigned by the foreman', now);
      if (moved.length)
        this.audit.record({
          actorId: actor.id,
          action: 'clock-off',
          entity: 'job-line',
          entityId: id,
          detail: { technicianIds: moved, reason: 'reassigned' },
        });
    }
    if (body.bayId !== undefined && body.bayId !== line.bayId) changes.bayId = body.bayId;
    if (body.status === 'held')
      Object.assign(changes, { status: 'held', holdReason: body.holdReason, heldAt: now });
    if (body.status === 'queued' || body.status === 'working')
      Object.assign(changes, { status: body.status, holdReason: null, heldAt: null, signOff: null });
    if (body.status === 'done' || body.completedAt) {
      if (line.status !== 'done') changes.signOff = this.signOffNeeded(id, now);
      this.punches.clockOffLine(id, actor, 'Line marked done by the foreman', now);
      Object.assign(changes, {
        status: 'done',
        holdReason: null,
        heldAt: null,
        completedAt: body.completedAt ? new Date(body.completedAt) : now,
      });
    }
    const updated = this.save(id, changes);
    if (changes.bayId) this.stageBay(changes.bayId, updated.repairOrderId, now);
    if (updated.status === 'done' && line.status !== 'done') this.afterDone(updated, 'check', now);
    this.audit.record({
      actorId: actor.id,
      action: 'update',
      entity: 'job-line',
      entityId: id,
      detail: body,
    });
    return this.announce(updated);
  }

  @Transactional()
  hold(id: number, { reason }: HoldLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.findForActor(id, actor, now);
    if (line.status === 'done') throw new ConflictException('That line is already done');
    this.punches.clockOffLine(id, actor, `Line held: ${reason}`, now);
    const updated = this.save(id, { status: 'held', holdReason: reason, heldAt: now, updatedAt: now });
    this.audit.record({
      actorId: actor.id,
      action: 'hold',
      entity: 'job-line',
      entityId: id,
      detail: { reason },
    });
    return this.announce(updated);
  }

  @Transactional()
  resume(id: number, actor: Principal, now = new Date()): JobLineDto {
    const line = this.findForActor(id, actor, now);
    if (line.status !== 'held') return toJobLineDto(line);
    const updated = this.save(id, { status: 'queued', holdReason: null, heldAt: null, updatedAt: now });
    this.audit.record({ actorId: actor.id, action: 'resume', entity: 'job-line', entityId: id });
    return this.announce(updated);
  }

  @Transactional()
  finish(id: number, { next }: FinishLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.findForActor(id, actor, now);
    if (line.status === 'done') return toJobLineDto(line);
    this.closedWeeks.assertOpenAt(now, 'Finishing that line');
    const signOff = this.signOffNeeded(id, now);
    this.punches.clockOffLine(id, actor, 'Line marked done', now);
    const updated = this.save(id, {
      status: 'done',
      holdReason: null,
      heldAt: null,
      completedAt: now,
      updatedAt: now,
      signOff,
    });
    this.afterDone(updated, next, now);
    this.audit.record({
      actorId: actor.id,
      action: 'done',
      entity: 'job-line',
      entityId: id,
      detail: { next },
    });
    return this.announce(updated);
  }

  @Transactional()
  signOff(id: number, { reason }: ResolutionBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.find(id);
    if (line.status !== 'done' || line.signOff !== 'awaiting')
      throw new ConflictException('That line is not waiting for a sign-off');
    const updated = this.save(id, {
      signOff: 'signed',
      signedOffBy: actor.id,
      signedOffAt: now,
      signOffReason: reason,
      updatedAt: now,
    });
    this.audit.record({
      actorId: actor.id,
      action: 'sign-off',
      entity: 'job-line',
      entityId: id,
      detail: { reason },
    });
    return this.announce(updated);
  }

  /**
   * Done on a line nobody clocked on would flag its book hours while the same time is paid as idle time. A
   * line finished with less clocked time than the shop's minimum waits for a foreman's sign-off and stays
   * out of the flagged figures until then.
   */
  private signOffNeeded(id: number, now: Date): 'awaiting' | null {
    const clocked = this.labour.lineSeconds([id], now).get(id)?.total ?? 0;
    return clocked < this.shop.settings(now).minimumClockedMinutesForDone * 60 ? 'awaiting' : null;
  }

  /** The last open line in a bay moves the bay to check or ready; the last on an RO finishes the RO. */
  private afterDone(line: LineRow, next: 'check' | 'ready', now: Date): void {
    const openInRo = this.db
      .select()
      .from(jobLines)
      .where(and(eq(jobLines.repairOrderId, line.repairOrderId), ne(jobLines.status, 'done')))
      .all();
    if (openInRo.length === 0)
      this.db
        .update(repairOrders)
        .set({ status: 'done' })
        .where(eq(repairOrders.id, line.repairOrderId))
        .run();
    if (!line.bayId) return;
    const openInBay = this.db
      .select()
      .from(jobLines)
      .where(and(eq(jobLines.bayId, line.bayId), ne(jobLines.status, 'done')))
      .all();
    if (openInBay.length === 0)
      this.db
        .update(bays)
        .set({ phase: next, phaseSince: now, repairOrderId: line.repairOrderId })
        .where(eq(bays.id, line.bayId))
        .run();
  }

  private stageBay(bayId: number, repairOrderId: number, now: Date): void {
    const bay = this.db.select().from(bays).where(eq(bays.id, bayId)).get();
    if (bay && (bay.phase === 'free' || bay.repairOrderId !== repairOrderId))
      this.db
        .update(bays)
        .set({ phase: 'staged', phaseSince: now, repairOrderId })
        .where(eq(bays.id, bayId))
        .run();
  }

  private find(id: number): LineRow {
    return foundOrFail(this.db.select().from(jobLines).where(eq(jobLines.id, id)).get(), 'Job line');
  }

  /** A technician acts on lines assigned to them or that they are clocked on; office roles on any. */
  private findForActor(id: number, actor: Principal, now: Date): LineRow {
    const line = this.find(id);
    if (
      actor.role === 'technician' &&
      line.technicianId !== actor.id &&
      !this.floor.clockedOn(id, now).includes(actor.id)
    )
      throw new ForbiddenException('That line is not yours: ask the foreman');
    return line;
  }

  private assertTechnician(id: number): void {
    const tech = this.db
      .select()
      .from(users)
      .where(and(eq(users.id, id), eq(users.role, 'technician')))
      .get();
    if (!tech?.active) throw new BadRequestException('No active technician with that id');
  }

  private save(id: number, changes: Partial<typeof jobLines.$inferInsert>): LineRow {
    return this.db.update(jobLines).set(changes).where(eq(jobLines.id, id)).returning().get();
  }

  private announce(line: LineRow): JobLineDto {
    const jobLine = toJobLineDto(line);
    this.live.publish('job-line.updated', { jobLine });
    this.floor.linesChanged([line.id]);
    this.floor.baysChanged();
    return jobLine;
  }
}
