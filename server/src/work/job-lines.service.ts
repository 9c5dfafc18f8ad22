import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { and, eq, isNull, ne, or } from 'drizzle-orm';
import {
  formatDayClockTime,
  inSentence,
  JOB_LINE_STATUS_WORDS,
  isOpenLine,
  kioskDoneSchema,
  lineWords,
  type CancelJobLineBody,
  type EditJobLineBody,
  type LineDetailField,
  type FinishLineBody,
  type HoldLineBody,
  type JobLineDto,
  type PatchJobLineBody,
  type ResolutionBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { referencedBay } from '../bays/referenced-bay.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { bays, findings, jobLines, punches, repairOrders, timers, users } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { LabourService } from '../labour/labour.service.js';
import { LineAccessService } from '../floor/line-access.service.js';
import { LiveService } from '../live/live.service.js';
import { ClosedWeeksService } from '../payroll/closed-weeks.service.js';
import { PunchesService } from '../punches/punches.service.js';
import { ShopService } from '../shop/shop.service.js';
import { WebhookOutbox } from '../webhooks/webhook-outbox.service.js';
import { announceLine } from './announce-line.js';
import { toJobLineDto } from './job-line.dto.js';
import { syncRepairOrderStatus } from './repair-order-status.js';
import { PartsService } from './parts.service.js';

/** A line's details as its row's columns: an emptied cause or correction is no longer on record. */
function asLineRow<Fields extends { cause?: string | null; correction?: string | null }>(fields: Fields) {
  return {
    ...fields,
    ...(fields.cause === '' && { cause: null }),
    ...(fields.correction === '' && { correction: null }),
  };
}

/** A line's details in words, for a conflict that names what someone else changed. */
const LINE_DETAIL_WORDS: Record<LineDetailField, string> = {
  title: 'job',
  bookHours: 'book hours',
  skillLevel: 'skill level',
  concern: 'concern',
  cause: 'cause',
  correction: 'correction',
};

type LineRow = typeof jobLines.$inferSelect;

/**
 * Changes to job lines: the foreman's dispatch, a technician's hold and done from the kiosk, and the
 * office's corrections after the fact (details, cancel, delete).
 */
@Injectable()
export class JobLinesService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly floor: FloorService,
    private readonly access: LineAccessService,
    private readonly punches: PunchesService,
    private readonly webhooks: WebhookOutbox,
    private readonly closedWeeks: ClosedWeeksService,
    private readonly shop: ShopService,
    private readonly labour: LabourService,
    private readonly parts: PartsService,
  ) {}

  @Transactional()
  patch(id: number, body: PatchJobLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.find(id);
    if (line.status === 'cancelled') throw new ConflictException('That line was cancelled');
    this.assertRepairOrderOpen(line);
    if (body.technicianId) this.assertTechnician(body.technicianId);
    if (body.bayId) referencedBay(this.db, body.bayId);
    if (body.completedAt && new Date(body.completedAt) > now)
      throw new BadRequestException('A line cannot be finished in the future');
    const reopened = line.status === 'done' && body.status !== undefined && body.status !== 'done';
    if (body.completedAt) this.closedWeeks.assertOpenAt(new Date(body.completedAt), 'That completion time');
    else if (body.status === 'done' && line.status !== 'done')
      this.closedWeeks.assertOpenAt(now, 'Finishing that line');
    // Its book hours would be flagged in a week before the line was written.
    if (body.completedAt && new Date(body.completedAt) < line.queuedAt) {
      const { timeZone, clockFormat } = this.shop.settings(now);
      throw new BadRequestException(
        `That line was added at ${formatDayClockTime(line.queuedAt.toISOString(), timeZone, clockFormat)}: it cannot be finished before then`,
      );
    }
    if (body.bayId && body.bayId !== line.bayId) this.assertBayFor(body.bayId, line);

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
    if (reopened) Object.assign(changes, NOT_FINISHED);
    if (body.status === 'held' && body.holdReason) {
      if (line.status !== 'held' || line.holdReason !== body.holdReason)
        this.holdSteps(id, body.holdReason, undefined, actor, now);
      Object.assign(changes, { status: 'held', holdReason: body.holdReason, heldAt: line.heldAt ?? now });
    }
    if (body.status === 'queued' || body.status === 'working')
      Object.assign(changes, { status: body.status, holdReason: null, heldAt: null });
    if (body.status === 'done' || body.completedAt) {
      if (line.status !== 'done') changes.signOff = this.signOffNeeded(id, now);
      this.punches.clockOffLine(id, actor, 'Line marked done by the foreman', now);
      this.stopTimers(id, now);
      Object.assign(changes, {
        status: 'done',
        holdReason: null,
        heldAt: null,
        completedAt: body.completedAt ? new Date(body.completedAt) : now,
        completedBy: line.status === 'done' ? line.completedBy : actor.id,
      });
    }
    const updated = this.save(id, changes);
    if (changes.bayId !== undefined && line.bayId) this.leaveBay(line.bayId, line.repairOrderId, now);
    if (updated.bayId && (changes.bayId || reopened))
      this.stageBay(updated.bayId, updated.repairOrderId, now);
    if (updated.status === 'done' && line.status !== 'done') this.afterDone(updated, 'check', now);
    else if (updated.status !== line.status) this.statusChanged(updated, now);
    this.audit.record({
      actorId: actor.id,
      action: 'update',
      entity: 'job-line',
      entityId: id,
      // What it was, so the RO's history can say "reassigned from Dana to Luis".
      detail: { ...body, was: { technicianId: line.technicianId, bayId: line.bayId, status: line.status } },
    });
    return this.announce(updated);
  }

  @Transactional()
  hold(id: number, { reason, part }: HoldLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.findForActor(id, actor, now);
    if (!isOpenLine(line))
      throw new ConflictException(`That line is already ${inSentence(JOB_LINE_STATUS_WORDS[line.status])}`);
    this.holdSteps(id, reason, part, actor, now);
    const updated = this.save(id, { status: 'held', holdReason: reason, heldAt: now, updatedAt: now });
    this.audit.record({
      actorId: actor.id,
      action: 'hold',
      entity: 'job-line',
      entityId: id,
      detail: { reason, ...(part && { part }) },
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
  finish(id: number, body: FinishLineBody, actor: Principal, now = new Date()): JobLineDto {
    // The cause and correction are the RO's warranty record: a technician's Done needs them whatever
    // sent it, not only the kiosk's form. The foreman may close a line without words.
    if (actor.role === 'technician') {
      const words = kioskDoneSchema.safeParse(body);
      if (!words.success)
        throw new BadRequestException({
          statusCode: 400,
          message: words.error.issues.map((issue) => issue.message).join('; '),
          issues: words.error.issues.map(({ path, message }) => ({ path: path.map(String), message })),
        });
    }
    const { next, cause, correction } = body;
    const line = this.findForActor(id, actor, now);
    if (line.status === 'done') return toJobLineDto(line);
    if (line.status === 'cancelled') throw new ConflictException('That line was cancelled');
    this.closedWeeks.assertOpenAt(now, 'Finishing that line');
    const signOff = this.signOffNeeded(id, now);
    this.punches.clockOffLine(id, actor, 'Line marked done', now);
    this.stopTimers(id, now);
    const updated = this.save(id, {
      status: 'done',
      holdReason: null,
      heldAt: null,
      completedAt: now,
      completedBy: actor.id,
      ...threeCs({ cause, correction }),
      updatedAt: now,
      signOff,
    });
    this.afterDone(updated, next, now);
    this.audit.record({
      actorId: actor.id,
      action: 'done',
      entity: 'job-line',
      entityId: id,
      detail: { next, ...threeCs({ cause, correction }) },
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

  /** The advisor's corrections to a line: title, book hours, skill level and the three Cs. */
  @Transactional()
  editDetails(id: number, { was, ...body }: EditJobLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.find(id);
    const moved = Object.keys(changedFields(line, asLineRow(was ?? {}))).map(
      (field) => LINE_DETAIL_WORDS[field as LineDetailField],
    );
    if (moved.length > 0)
      throw new ConflictException(
        `Someone else changed the ${moved.join(' and the ')} of ${lineWords(line.lineNo)} since you opened it: reload to see their change`,
      );
    this.assertRepairOrderOpen(line);
    const changes = changedFields(line, asLineRow(body));
    if (Object.keys(changes).length === 0) return toJobLineDto(line);
    const updated = this.save(id, {
      ...Object.fromEntries(Object.entries(changes).map(([key, { to }]) => [key, to])),
      updatedAt: now,
    });
    this.audit.record({
      actorId: actor.id,
      action: 'edit',
      entity: 'job-line',
      entityId: id,
      detail: { changes },
    });
    return this.announce(updated);
  }

  /**
   * Takes an open line off the RO with a reason: whoever is clocked on it is clocked off and its timer
   * stops. The line and its time stay on record; it is never flagged.
   */
  @Transactional()
  cancel(id: number, { reason }: CancelJobLineBody, actor: Principal, now = new Date()): JobLineDto {
    const line = this.find(id);
    if (!isOpenLine(line))
      throw new ConflictException(`That line is already ${inSentence(JOB_LINE_STATUS_WORDS[line.status])}`);
    this.punches.clockOffLine(id, actor, `Line cancelled: ${reason}`, now);
    this.stopTimers(id, now);
    const updated = this.save(id, {
      status: 'cancelled',
      cancelReason: reason,
      holdReason: null,
      heldAt: null,
      updatedAt: now,
    });
    this.statusChanged(updated, now);
    // Nothing left to do in the bay: the car goes to its check when work was done on it there.
    if (line.bayId && !this.openLinesIn(line.bayId).length)
      this.moveBay(line.bayId, this.doneIn(line.bayId, line.repairOrderId) ? 'check' : 'ready', line, now);
    this.audit.record({
      actorId: actor.id,
      action: 'cancel',
      entity: 'job-line',
      entityId: id,
      detail: { reason },
    });
    return this.announce(updated);
  }

  /**
   * Deletes a line written by mistake. One with time, a finding or a timer on it stays on record:
   * it can only be cancelled with a reason.
   */
  @Transactional()
  remove(id: number, actor: Principal, now = new Date()): void {
    const line = this.find(id);
    const ro = this.db.select().from(repairOrders).where(eq(repairOrders.id, line.repairOrderId)).get()!;
    if (ro.status === 'closed') throw new ConflictException('That repair order is closed');
    if (line.status === 'done') throw new ConflictException('That line is done: it stays on the RO');
    const clocked = this.db.select({ id: punches.id }).from(punches).where(eq(punches.jobLineId, id)).get();
    if (clocked)
      throw new ConflictException('Time was clocked on that line: cancel it with a reason instead');
    const found = this.db
      .select({ id: findings.id })
      .from(findings)
      .where(or(eq(findings.jobLineId, id), eq(findings.createdLineId, id)))
      .get();
    const timed = this.db.select({ id: timers.id }).from(timers).where(eq(timers.jobLineId, id)).get();
    if (found || timed)
      throw new ConflictException(
        'That line has a finding or a timer on record: cancel it with a reason instead',
      );
    this.db.delete(jobLines).where(eq(jobLines.id, id)).run();
    const rest = this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(eq(jobLines.repairOrderId, ro.id))
      .orderBy(jobLines.lineNo)
      .all();
    this.renumber(
      rest.map((row) => row.id),
      now,
    );
    this.statusChanged(line, now);
    this.audit.record({
      actorId: actor.id,
      action: 'line-removed',
      entity: 'repair-order',
      entityId: ro.id,
      detail: { jobLineId: id, lineNo: line.lineNo, title: line.title },
    });
    this.live.publish('repair-order.updated', { repairOrderId: ro.id });
    this.floor.linesChanged([id, ...rest.map((row) => row.id)]);
    this.floor.baysChanged();
  }

  /**
   * Numbers the RO's lines 1, 2, 3… in the given order. Through negative numbers first, so the
   * unique (RO, line number) index never sees two lines with one number.
   */
  renumber(lineIds: readonly number[], now: Date): void {
    lineIds.forEach((id, i) =>
      this.db
        .update(jobLines)
        .set({ lineNo: -(i + 1) })
        .where(eq(jobLines.id, id))
        .run(),
    );
    lineIds.forEach((id, i) =>
      this.db
        .update(jobLines)
        .set({ lineNo: i + 1, updatedAt: now })
        .where(eq(jobLines.id, id))
        .run(),
    );
  }

  /**
   * The last open line in a bay moves the bay to check or ready; the last on an RO finishes the RO.
   * Webhooks hear of the finished line.
   */
  private afterDone(line: LineRow, next: 'check' | 'ready', now: Date): void {
    const ro = this.db.select().from(repairOrders).where(eq(repairOrders.id, line.repairOrderId)).get()!;
    this.webhooks.announce(
      'job-line.finished',
      {
        jobLineId: line.id,
        ...announcedRepairOrder(ro),
        title: line.title,
        technicianId: line.technicianId,
        completedAt: (line.completedAt ?? now).toISOString(),
      },
      now,
    );
    this.statusChanged(line, now);
    if (line.bayId && !this.openLinesIn(line.bayId).length) this.moveBay(line.bayId, next, line, now);
  }

  private moveBay(bayId: number, phase: 'check' | 'ready', line: LineRow, now: Date): void {
    this.db
      .update(bays)
      .set({ phase, phaseSince: now, repairOrderId: line.repairOrderId })
      .where(eq(bays.id, bayId))
      .run();
  }

  private openLinesIn(bayId: number): LineRow[] {
    return this.db
      .select()
      .from(jobLines)
      .where(and(eq(jobLines.bayId, bayId), ne(jobLines.status, 'done'), ne(jobLines.status, 'cancelled')))
      .all();
  }

  private doneIn(bayId: number, repairOrderId: number): boolean {
    return !!this.db
      .select({ id: jobLines.id })
      .from(jobLines)
      .where(
        and(
          eq(jobLines.bayId, bayId),
          eq(jobLines.repairOrderId, repairOrderId),
          eq(jobLines.status, 'done'),
        ),
      )
      .get();
  }

  /** Ends the line's running timers: its work is over. */
  private stopTimers(id: number, now: Date): void {
    const stopped = this.db
      .update(timers)
      .set({ endedAt: now })
      .where(and(eq(timers.jobLineId, id), isNull(timers.endedAt)))
      .returning()
      .all();
    if (stopped.length) this.floor.timersChanged();
  }

  /** The steps of a hold besides the status: whoever is on the line is clocked off, a parts hold noted. */
  private holdSteps(
    id: number,
    reason: HoldLineBody['reason'],
    part: string | undefined,
    actor: Principal,
    now: Date,
  ): void {
    this.punches.clockOffLine(id, actor, `Line held: ${reason}`, now);
    if (reason === 'parts') this.parts.noteHold(id, part, now);
  }

  /**
   * The RO follows its lines; the office's RO pages hear when its status moved, and webhooks hear of
   * the RO ready when the line (finished, cancelled or removed) leaves none open.
   */
  private statusChanged(line: LineRow, now: Date): void {
    const ro = this.db.select().from(repairOrders).where(eq(repairOrders.id, line.repairOrderId)).get()!;
    const status = syncRepairOrderStatus(this.db, ro.id);
    if (status === ro.status) return;
    this.live.publish('repair-order.updated', { repairOrderId: ro.id });
    if (status === 'done')
      this.webhooks.announce(
        'repair-order.ready',
        { ...announcedRepairOrder(ro), bayId: line.bayId, readyAt: now.toISOString() },
        now,
      );
  }

  /** A line put in a bay (or opened again there) brings its car: the bay is staged for it. */
  private stageBay(bayId: number, repairOrderId: number, now: Date): void {
    const bay = this.db.select().from(bays).where(eq(bays.id, bayId)).get();
    if (bay && (bay.phase !== 'staged' || bay.repairOrderId !== repairOrderId))
      this.db
        .update(bays)
        .set({ phase: 'staged', phaseSince: now, repairOrderId })
        .where(eq(bays.id, bayId))
        .run();
  }

  /** A car holds its bay until it leaves: another RO's line waits for the bay to be released. */
  private assertBayFor(bayId: number, line: LineRow): void {
    const bay = this.db.select().from(bays).where(eq(bays.id, bayId)).get()!;
    const holder =
      bay.repairOrderId ??
      this.openLinesIn(bayId).find((other) => other.repairOrderId !== line.repairOrderId)?.repairOrderId ??
      null;
    if (holder === null || holder === line.repairOrderId) return;
    const ro = this.db
      .select({ number: repairOrders.number })
      .from(repairOrders)
      .where(eq(repairOrders.id, holder))
      .get()!;
    throw new ConflictException(
      `${bay.name} holds RO ${ro.number} until it leaves: pick another bay, or release ${bay.name} first`,
    );
  }

  /** The last of the RO's open lines moved out of a bay where its car was only staged: the car went with them. */
  private leaveBay(bayId: number, repairOrderId: number, now: Date): void {
    const bay = this.db.select().from(bays).where(eq(bays.id, bayId)).get();
    if (bay?.phase !== 'staged' || bay.repairOrderId !== repairOrderId) return;
    if (this.openLinesIn(bayId).some((other) => other.repairOrderId === repairOrderId)) return;
    this.db
      .update(bays)
      .set({ phase: 'free', phaseSince: now, repairOrderId: null })
      .where(eq(bays.id, bayId))
      .run();
  }

  private assertRepairOrderOpen(line: LineRow): void {
    const ro = this.db
      .select({ status: repairOrders.status })
      .from(repairOrders)
      .where(eq(repairOrders.id, line.repairOrderId))
      .get()!;
    if (ro.status === 'closed')
      throw new ConflictException('That repair order is closed: its lines stay as they were picked up');
  }

  private find(id: number): LineRow {
    return foundOrFail(this.db.select().from(jobLines).where(eq(jobLines.id, id)).get(), 'Job line');
  }

  /** A technician acts on lines assigned to them or that they are clocked on; the foreman on any. */
  private findForActor(id: number, actor: Principal, now: Date): LineRow {
    const line = this.find(id);
    this.access.assertMayWork(line, actor, now);
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
    return announceLine(line, this.live, this.floor);
  }
}

/** Cause and correction as stored: left out or empty means nothing was written. */
function threeCs(given: { cause?: string | undefined; correction?: string | undefined }) {
  return {
    ...(given.cause && { cause: given.cause }),
    ...(given.correction && { correction: given.correction }),
  };
}

/** A line opened again: no longer finished, nor signed off. */
const NOT_FINISHED = {
  completedAt: null,
  completedBy: null,
  signOff: null,
  signedOffBy: null,
  signedOffAt: null,
  signOffReason: null,
} satisfies Partial<typeof jobLines.$inferInsert>;

/** How a webhook names the RO: its id, its number and the other system's reference. */
function announcedRepairOrder(ro: typeof repairOrders.$inferSelect) {
  return { repairOrderId: ro.id, repairOrderNumber: ro.number, externalRef: ro.externalRef };
}

type Changes = Record<string, { from: unknown; to: unknown }>;

/** The fields the body really changes, each with what it was: the audit row's detail. */
export function changedFields<Row extends Record<string, unknown>>(row: Row, body: Partial<Row>): Changes {
  const changes: Changes = {};
  const same = (a: unknown, b: unknown) =>
    a instanceof Date && b instanceof Date ? a.getTime() === b.getTime() : a === b;
  for (const [key, to] of Object.entries(body))
    if (to !== undefined && !same(row[key] ?? null, to)) changes[key] = { from: row[key] ?? null, to };
  return changes;
}
