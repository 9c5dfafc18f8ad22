import { BadRequestException, ConflictException, Inject, Injectable, Logger } from '@nestjs/common';
import { Interval } from '@nestjs/schedule';
import { and, asc, eq, inArray, isNull, lte } from 'drizzle-orm';
import {
  inSentence,
  JOB_LINE_STATUS_WORDS,
  isOpenLine,
  type HoldPresetBody,
  type HoldPresetDto,
  type StartTimerBody,
  type TimerDto,
  type TimerReadingBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { referencedBay } from '../bays/referenced-bay.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail, referencedOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { bays, holdPresets, jobLines, timerReadings, timers } from '../db/schema/index.js';
import { keepServing } from '../common/keep-serving.js';
import { FloorService } from '../floor/floor.service.js';
import { LineAccessService } from '../floor/line-access.service.js';
import { LiveService } from '../live/live.service.js';
import { reachesTarget, toTimerDto } from './timer-view.js';

const TICK_MS = 1000;

@Injectable()
export class TimersService {
  private readonly logger = new Logger(TimersService.name);
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
    private readonly live: LiveService,
    private readonly floor: FloorService,
    private readonly access: LineAccessService,
  ) {}

  /** Set times end on their own: a tick marks them reached so screens and kiosks hear it. */
  @Interval(TICK_MS)
  endFixedWaits(): void {
    keepServing(this.logger, 'Ending fixed waits', () => this.markEndedHolds());
  }

  running(now = new Date()): TimerDto[] {
    const rows = this.db
      .select()
      .from(timers)
      .where(isNull(timers.endedAt))
      .orderBy(asc(timers.startedAt))
      .all();
    const readings = rows.length
      ? this.db
          .select()
          .from(timerReadings)
          .where(
            inArray(
              timerReadings.timerId,
              rows.map((t) => t.id),
            ),
          )
          .orderBy(asc(timerReadings.at))
          .all()
      : [];
    return rows.map((row) =>
      toTimerDto(
        row,
        readings.filter((r) => r.timerId === row.id),
        now,
        this.lineTechnician(row.jobLineId),
      ),
    );
  }

  get(id: number, now = new Date()): TimerDto {
    const row = foundOrFail(this.db.select().from(timers).where(eq(timers.id, id)).get(), 'Timer');
    return toTimerDto(row, this.readingsOf(id), now, this.lineTechnician(row.jobLineId));
  }

  /** Whose line the timer runs on: their kiosk is the one that chimes. */
  private lineTechnician(jobLineId: number): number | null {
    return this.floor.openLine(jobLineId)?.technicianId ?? null;
  }

  @Transactional()
  start(body: StartTimerBody, actor: Principal, now = new Date()): TimerDto {
    const line = referencedOrFail(
      this.db.select().from(jobLines).where(eq(jobLines.id, body.jobLineId)).get(),
      'job line',
    );
    this.access.assertMayWork(line, actor, now);
    if (body.bayId !== undefined) this.assertLineInBay(line, referencedBay(this.db, body.bayId));
    if (!isOpenLine(line))
      throw new ConflictException(`That line is ${inSentence(JOB_LINE_STATUS_WORDS[line.status])}`);
    const busy = this.db
      .select()
      .from(timers)
      .where(and(eq(timers.jobLineId, line.id), isNull(timers.endedAt)))
      .get();
    if (busy) throw new ConflictException('A timer is already running on this line: stop it first');
    // An engine running or hot fluid is shown on the wall by its bay: with no bay, nobody else would see it.
    if (body.kind !== 'set-time' && (body.bayId ?? line.bayId) === null)
      throw new ConflictException('Put the line in a bay first: the wall shows a running engine by its bay');
    const row = this.db
      .insert(timers)
      .values({
        jobLineId: line.id,
        bayId: body.bayId ?? line.bayId,
        kind: body.kind,
        targetC: body.kind === 'set-time' ? null : (body.targetC ?? null),
        ambientC: body.kind === 'set-time' ? null : (body.ambientC ?? null),
        durationSeconds: body.kind === 'set-time' ? (body.durationSeconds ?? null) : null,
        label: body.label ?? null,
        startedAt: now,
        startedBy: actor.id,
      })
      .returning()
      .get();
    this.audit.record({
      actorId: actor.id,
      action: 'start',
      entity: 'timer',
      entityId: row.id,
      detail: { ...body },
    });
    return this.announce(row.id, row.bayId, now);
  }

  @Transactional()
  addReading(id: number, body: TimerReadingBody, actor: Principal, now = new Date()): TimerDto {
    const timer = this.findForActor(id, actor, now);
    if (timer.endedAt) throw new ConflictException('That timer was stopped');
    if (timer.kind === 'set-time') throw new BadRequestException('A set time takes no readings');
    const at = body.at ? new Date(body.at) : now;
    if (at > new Date(now.getTime() + 60_000))
      throw new BadRequestException('A reading cannot be in the future');
    if (at < new Date(timer.startedAt.getTime() - 60_000))
      throw new BadRequestException('That reading is from before the timer started');
    this.db.insert(timerReadings).values({ timerId: id, tempC: body.tempC, at, recordedBy: actor.id }).run();
    if (!timer.reachedAt && reachesTarget(timer, body.tempC))
      this.db.update(timers).set({ reachedAt: at }).where(eq(timers.id, id)).run();
    return this.announce(id, timer.bayId, now);
  }

  @Transactional()
  stop(id: number, actor: Principal, now = new Date()): TimerDto {
    const timer = this.findForActor(id, actor, now);
    if (!timer.endedAt) {
      this.db.update(timers).set({ endedAt: now }).where(eq(timers.id, id)).run();
      this.audit.record({ actorId: actor.id, action: 'stop', entity: 'timer', entityId: id });
    }
    return this.announce(id, timer.bayId, now);
  }

  presets(): HoldPresetDto[] {
    return this.db.select().from(holdPresets).orderBy(asc(holdPresets.name)).all();
  }

  @Transactional()
  addPreset(body: HoldPresetBody, actor: Principal): HoldPresetDto {
    const row = this.db.insert(holdPresets).values(body).returning().get();
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'hold-preset',
      entityId: row.id,
      detail: body,
    });
    return row;
  }

  @Transactional()
  removePreset(id: number, actor: Principal): HoldPresetDto {
    const row = foundOrFail(this.db.select().from(holdPresets).where(eq(holdPresets.id, id)).get(), 'Preset');
    this.db.delete(holdPresets).where(eq(holdPresets.id, id)).run();
    this.audit.record({ actorId: actor.id, action: 'delete', entity: 'hold-preset', entityId: id });
    return row;
  }

  @Transactional()
  markEndedHolds(now = new Date()): void {
    const due = this.db
      .select()
      .from(timers)
      .where(
        and(
          eq(timers.kind, 'set-time'),
          isNull(timers.endedAt),
          isNull(timers.reachedAt),
          lte(timers.startedAt, now),
        ),
      )
      .all()
      .filter((t) => t.startedAt.getTime() + (t.durationSeconds ?? 0) * 1000 <= now.getTime());
    for (const timer of due) {
      const endedAt = new Date(timer.startedAt.getTime() + (timer.durationSeconds ?? 0) * 1000);
      this.db.update(timers).set({ reachedAt: endedAt }).where(eq(timers.id, timer.id)).run();
      this.announce(timer.id, timer.bayId, now);
    }
  }

  /** A timer shows on the wall in its bay's tile: in another car's bay it would hide that bay's own state. */
  private assertLineInBay(line: typeof jobLines.$inferSelect, bay: typeof bays.$inferSelect): void {
    if (line.bayId === bay.id) return;
    if (line.bayId === null)
      throw new ConflictException(
        `That line is in no bay yet: put it in ${bay.name} first, then start its timer`,
      );
    const lineBay = this.db.select({ name: bays.name }).from(bays).where(eq(bays.id, line.bayId)).get();
    throw new ConflictException(`That line is in ${lineBay?.name ?? 'another bay'}: start its timer there`);
  }

  /** A timer belongs to its line: whoever may work the line may read into it and stop it. */
  private findForActor(id: number, actor: Principal, now: Date): typeof timers.$inferSelect {
    const timer = foundOrFail(this.db.select().from(timers).where(eq(timers.id, id)).get(), 'Timer');
    const line = foundOrFail(
      this.db.select().from(jobLines).where(eq(jobLines.id, timer.jobLineId)).get(),
      'Job line',
    );
    this.access.assertMayWork(line, actor, now);
    return timer;
  }

  private readingsOf(id: number) {
    return this.db
      .select()
      .from(timerReadings)
      .where(eq(timerReadings.timerId, id))
      .orderBy(asc(timerReadings.at))
      .all();
  }

  private announce(timerId: number, bayId: number | null, now: Date): TimerDto {
    // Every kiosk shows the shop's running timers and chimes when one is up.
    this.live.publish('timer.updated', { timerId, bayId }, { to: 'everyone' });
    this.floor.timersChanged();
    return this.get(timerId, now);
  }
}
