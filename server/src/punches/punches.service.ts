import {
  BadRequestException,
  ConflictException,
  ForbiddenException,
  Inject,
  Injectable,
} from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { and, asc, eq, sql } from 'drizzle-orm';
import {
  inSentence,
  JOB_LINE_STATUS_WORDS,
  isOpenLine,
  LATE_PUNCH_SECONDS,
  MAX_PUNCH_AGE_SECONDS,
  MAX_PUNCH_CLOCK_SKEW_SECONDS,
  punchImpact,
  type CreatePunchBody,
  type HeldPunchDto,
  type LedgerPunch,
  type PunchDto,
  type PunchImpact,
  type PunchKind,
  type ResolutionBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { foundOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { heldPunches, jobLines, punches, users } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { toPunchDto } from '../labour/labour.service.js';
import { LineAccessService } from '../floor/line-access.service.js';
import { LiveService } from '../live/live.service.js';
import { ClosedWeeksService } from '../payroll/closed-weeks.service.js';
import { ShopService } from '../shop/shop.service.js';
import { toJobLineDto } from '../work/job-line.dto.js';
import { counts } from './last-shift-out.js';
import { PunchLedgerService } from './punch-ledger.service.js';

export type RecordedPunch =
  | { punch: PunchDto; replayed: boolean; held: false }
  | { punch: HeldPunchDto; replayed: boolean; held: true };

type HeldRow = typeof heldPunches.$inferSelect;
type LineRow = typeof jobLines.$inferSelect;

export function toHeldPunchDto(row: HeldRow): HeldPunchDto {
  return {
    id: row.id,
    technicianId: row.technicianId,
    kind: row.kind,
    jobLineId: row.jobLineId,
    breakKind: row.breakKind,
    at: row.at.toISOString(),
    recordedAt: row.recordedAt.toISOString(),
    recordedBy: row.recordedBy,
    review: row.review,
    displaces: row.displaces,
    heldBecause: row.heldBecause,
    resolvedAt: row.resolvedAt?.toISOString() ?? null,
    resolvedBy: row.resolvedBy,
    resolution: row.resolution,
  };
}

const heldToLedger = (row: HeldRow): LedgerPunch => ({
  id: row.id,
  technicianId: row.technicianId,
  kind: row.kind,
  jobLineId: row.jobLineId,
  breakKind: row.breakKind,
  at: row.at.toISOString(),
  supersedes: null,
});

@Injectable()
export class PunchesService {
  private readonly queries: ReturnType<typeof preparePunchQueries>;

  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly floor: FloorService,
    private readonly live: LiveService,
    private readonly shop: ShopService,
    private readonly ledger: PunchLedgerService,
    private readonly closedWeeks: ClosedWeeksService,
    private readonly access: LineAccessService,
    private readonly audit: AuditService,
  ) {
    this.queries = preparePunchQueries(db);
  }

  /**
   * Records a punch once. The tablet's uuid makes a retry find the stored punch instead of adding a
   * second one. Everything here is synchronous on one connection, so two requests never interleave.
   *
   * A punch never silently voids counted ones. One that would make a counted punch impossible, or take
   * counted time off (judged up to the technician's last counted punch), is refused with 409 naming what it
   * would displace; but when it arrived late from the kiosk (an offline replay) it is kept, held for the
   * foreman's review and left out of every count (202). The rest of such a replay waits behind it.
   */
  @Transactional()
  record(
    body: CreatePunchBody,
    actor: Principal,
    now = new Date(),
    maxAgeSeconds = MAX_PUNCH_AGE_SECONDS,
  ): RecordedPunch {
    const technicianId = this.technicianFor(body, actor);
    const existing = this.queries.punch.get({ id: body.id });
    const existingHeld = existing ? undefined : this.queries.heldPunch.get({ id: body.id });
    if ((existing ?? existingHeld) && (existing ?? existingHeld)!.technicianId !== technicianId)
      throw new ConflictException('That punch id is already used');
    if (existing) return { punch: toPunchDto(existing), replayed: true, held: false };
    if (existingHeld) return { punch: toHeldPunchDto(existingHeld), replayed: true, held: true };

    const at = body.at ? new Date(body.at) : now;
    if (at.getTime() > now.getTime() + MAX_PUNCH_CLOCK_SKEW_SECONDS * 1000)
      throw new BadRequestException('A punch cannot be in the future: check the tablet clock');
    if (at.getTime() < now.getTime() - maxAgeSeconds * 1000)
      throw new BadRequestException(
        `That punch is more than ${maxAgeSeconds / 3600} hours old: ${
          actor.role === 'technician' ? 'ask the foreman to add it' : 'add it on the timecard as a correction'
        }`,
      );
    this.closedWeeks.assertOpenAt(at, 'That punch');
    const line = body.jobLineId ? this.queries.line.get({ id: body.jobLineId }) : undefined;
    if (body.jobLineId && !line) throw new BadRequestException('That job line does not exist');
    if (line) {
      this.assertMayPunchOn(line, body.kind, actor, now);
      this.ledger.assertLineExistedAt(line, at);
    }
    if (body.kind === 'job-on' && line && !isOpenLine(line))
      throw new ConflictException(`That job line is ${inSentence(JOB_LINE_STATUS_WORDS[line.status])}`);

    const candidate: LedgerPunch = {
      id: body.id,
      technicianId,
      kind: body.kind,
      jobLineId: body.jobLineId ?? null,
      // A break of no stated kind counts as paid rest, never as an unpaid meal (29 CFR 785.18).
      breakKind: body.kind === 'break-start' ? (body.breakKind ?? null) : null,
      at: at.toISOString(),
      supersedes: null,
    };
    const counted = this.floor.punchesOf(technicianId);
    const added = this.ledger.withJobOffs(counted, candidate);
    const impact = punchImpact(counted, added, this.shop.ledgerSettings(now));
    const late = now.getTime() - at.getTime() > LATE_PUNCH_SECONDS * 1000;
    // A replay's later punch waits behind its held one: when it came in late, or, however fresh, when it only
    // fits after it (a break's end behind a held break's start); refused, the tablet would drop it. Most
    // punches are neither, and never read the held ones.
    const waiting =
      actor.role === 'technician' &&
      (late || impact.refusal !== null) &&
      this.pendingOf(technicianId).some((held) => held.at <= at);
    if (impact.refusal && !waiting)
      throw new ConflictException(this.ledger.refusalFor(impact.refusal, technicianId, actor.id));
    const changesCounted = impact.displaced.length > 0 || impact.lowersCounted;
    if (changesCounted || waiting) {
      if ((late || waiting) && actor.role === 'technician')
        return { punch: this.hold(candidate, impact, waiting, actor, now), replayed: false, held: true };
      throw new ConflictException(this.displacementWords('That punch', impact));
    }

    const punch = added.map((each) => this.ledger.insert(each, { at: now, by: actor.id })).at(-1)!;
    if (line && body.kind === 'job-on') this.startWork(line, technicianId, actor, now);
    return { punch, replayed: false, held: false };
  }

  /**
   * Someone was clocked on a line, at the kiosk, by a correction or an accepted held punch: a queued line is
   * being worked, and one nobody had is theirs (audited), as the floor and the queue then show.
   */
  startWork(
    lineOrId: number | typeof jobLines.$inferSelect,
    technicianId: number,
    actor: Principal,
    now: Date,
  ): void {
    const line = typeof lineOrId === 'number' ? this.queries.line.get({ id: lineOrId }) : lineOrId;
    if (!line || (line.status !== 'queued' && line.technicianId !== null)) return;
    const taken = line.technicianId === null;
    const updated = this.db
      .update(jobLines)
      .set({
        ...(line.status === 'queued' ? { status: 'working' as const } : {}),
        ...(taken ? { technicianId } : {}),
        updatedAt: now,
      })
      .where(eq(jobLines.id, line.id))
      .returning()
      .get();
    if (taken)
      this.audit.record(
        {
          actorId: actor.id,
          action: 'take',
          entity: 'job-line',
          entityId: line.id,
          detail: { technicianId },
        },
        now,
      );
    this.live.publish(
      'job-line.updated',
      { jobLine: toJobLineDto(updated) },
      this.floor.lineAudience(updated),
    );
    this.floor.linesChanged([line.id]);
  }

  /**
   * Clock-ons were taken out of the count (a wrong punch voided, a correction that replaced or displaced
   * them): a working line of `lineIds` with no clock-on left was never worked, and goes back to the queue.
   */
  returnUnworked(lineIds: readonly number[], now: Date): void {
    for (const id of new Set(lineIds)) {
      const line = this.queries.line.get({ id });
      if (line?.status !== 'working') continue;
      const worked = this.db
        .select({ id: punches.id })
        .from(punches)
        .where(and(eq(punches.jobLineId, id), eq(punches.kind, 'job-on'), counts('punches')))
        .get();
      if (worked) continue;
      const updated = this.db
        .update(jobLines)
        .set({ status: 'queued', updatedAt: now })
        .where(eq(jobLines.id, id))
        .returning()
        .get();
      this.live.publish(
        'job-line.updated',
        { jobLine: toJobLineDto(updated) },
        this.floor.lineAudience(updated),
      );
      this.floor.linesChanged([id]);
    }
  }

  /**
   * The foreman accepts a held punch: it counts from now on, with the later punches of the same replay
   * that wait behind it (a late break's end after its start), judged together so that one of them never
   * voids a punch the next one makes fit again. What they displace together is voided, audited.
   */
  @Transactional()
  acceptHeld(id: string, { reason }: ResolutionBody, actor: Principal, now = new Date()): HeldPunchDto {
    const held = this.pendingHeld(id);
    const replay = [held, ...this.waitingBehind(held)];
    for (const row of replay) this.closedWeeks.assertOpenAt(row.at, 'That punch');
    const existing = this.ledger.around(held.technicianId, held.at);
    const added = replay.reduce<LedgerPunch[]>(
      (sofar, row) => [...sofar, ...this.ledger.withJobOffs([...existing, ...sofar], heldToLedger(row))],
      [],
    );
    const impact = punchImpact(existing, added, this.shop.ledgerSettings(now));
    if (impact.refusal)
      throw new ConflictException(
        replay.length > 1
          ? `It and the ${replay.length - 1} later ${replay.length > 2 ? 'punches' : 'punch'} of its replay no longer fit the timecard (${impact.refusal}): reject the one that is wrong, or correct the card`
          : `It no longer fits the timecard (${impact.refusal}): reject it or correct the card`,
      );
    const recordedWith = new Map(replay.map((row) => [row.id, row]));
    for (const punch of added) {
      const row = recordedWith.get(punch.id) ?? held;
      this.ledger.insert(punch, {
        at: row.recordedAt,
        by: row.recordedBy,
        reason: `Held for review, accepted by the office: ${reason}`,
      });
    }
    const voided = this.ledger.voidDisplaced(
      impact.displaced,
      actor,
      `Displaced by a late punch the office accepted: ${reason}`,
      now,
    );
    for (const row of replay)
      if (row.kind === 'job-on' && row.jobLineId !== null)
        this.startWork(row.jobLineId, row.technicianId, actor, now);
    for (const row of replay.slice(1))
      this.resolve(row, 'accepted', reason, actor, now, { acceptedWith: held.id });
    return this.resolve(held, 'accepted', reason, actor, now, { voided });
  }

  /** The foreman rejects a held punch: it stays on record, never counted. */
  @Transactional()
  rejectHeld(id: string, { reason }: ResolutionBody, actor: Principal, now = new Date()): HeldPunchDto {
    return this.resolve(this.pendingHeld(id), 'rejected', reason, actor, now, {});
  }

  /** Held punches of a technician (for the timecard), or pending ones of everyone. */
  held(technicianId: number, from: Date, to: Date): HeldPunchDto[] {
    return this.db
      .select()
      .from(heldPunches)
      .where(eq(heldPunches.technicianId, technicianId))
      .orderBy(asc(heldPunches.at))
      .all()
      .filter((row) => row.at >= from && row.at < to)
      .map(toHeldPunchDto);
  }

  /** "That punch would leave the clock on at … not counted: ask the foreman to correct the timecard". */
  displacementWords(what: string, impact: PunchImpact): string {
    if (impact.displaced.length > 0)
      return `${what} would leave ${this.ledger.listInWords(impact.displaced)} not counted: ask the foreman to correct the timecard`;
    return `${what} would take time already counted off the timecard: ask the foreman to correct the timecard`;
  }

  private hold(
    candidate: LedgerPunch,
    impact: PunchImpact,
    waiting: boolean,
    actor: Principal,
    now: Date,
  ): HeldPunchDto {
    const displaces = this.ledger.describe(impact.displaced);
    const because = waiting
      ? `${this.ledger.listInWords([candidate])} came in late behind a punch held for review`
      : this.displacementWords(
          `The late ${this.ledger.listInWords([candidate]).replace(/^the /, '')}`,
          impact,
        ).replace(': ask the foreman to correct the timecard', ': accept or reject it');
    const row = this.db
      .insert(heldPunches)
      .values({
        ...candidate,
        at: new Date(candidate.at),
        recordedAt: now,
        recordedBy: actor.id,
        displaces,
        heldBecause: because,
      })
      .returning()
      .get();
    this.audit.record(
      { actorId: actor.id, action: 'hold', entity: 'punch', entityId: row.id, detail: { because } },
      now,
    );
    return toHeldPunchDto(row);
  }

  private pendingOf(technicianId: number): HeldRow[] {
    return this.queries.pendingOf.all({ technicianId });
  }

  /** Pending punches that came in after a held one, later in time: the rest of its replay. */
  private waitingBehind(held: HeldRow): HeldRow[] {
    return this.pendingOf(held.technicianId)
      .filter((row) => row.id !== held.id && row.at >= held.at && row.recordedAt >= held.recordedAt)
      .sort((a, b) => a.at.getTime() - b.at.getTime());
  }

  private pendingHeld(id: string): HeldRow {
    const held = foundOrFail(this.queries.heldPunch.get({ id }), 'Held punch');
    if (held.review !== 'pending') throw new ConflictException(`That punch was already ${held.review}`);
    return held;
  }

  private resolve(
    held: HeldRow,
    review: 'accepted' | 'rejected',
    reason: string,
    actor: Principal,
    now: Date,
    detail: Record<string, unknown>,
  ): HeldPunchDto {
    const row = this.db
      .update(heldPunches)
      .set({ review, resolvedAt: now, resolvedBy: actor.id, resolution: reason })
      .where(eq(heldPunches.id, held.id))
      .returning()
      .get();
    this.audit.record(
      {
        actorId: actor.id,
        action: review === 'accepted' ? 'accept' : 'reject',
        entity: 'punch',
        entityId: held.id,
        detail: { reason, ...detail },
      },
      now,
    );
    return toHeldPunchDto(row);
  }

  /**
   * Clocks everyone off a line (it was held, finished or moved), as job-off punches recorded by the
   * actor with the reason, so the timecards show who closed the interval and why.
   */
  @Transactional()
  clockOffLine(jobLineId: number, actor: Principal, reason: string, now = new Date()): number[] {
    const technicianIds = this.floor.clockedOn(jobLineId, now);
    for (const technicianId of technicianIds) {
      const row = this.db
        .insert(punches)
        .values({
          id: randomUUID(),
          technicianId,
          kind: 'job-off',
          jobLineId,
          at: now,
          recordedAt: now,
          recordedBy: actor.id,
          reason: technicianId === actor.id ? null : reason,
        })
        .returning()
        .get();
      const punch = toPunchDto(row);
      this.live.publish('punch.recorded', { punch }, { to: 'floor', technicianIds: [technicianId] });
      this.floor.punchRecorded(punch);
    }
    return technicianIds;
  }

  /**
   * A technician clocks onto a line assigned to them, or onto an unassigned one when the shop lets
   * technicians take them (clocking on takes it); they clock off a line they are on. Putting a helper
   * on someone else's line is the foreman's call: the foreman and owner punch anyone onto any line.
   */
  private assertMayPunchOn(line: LineRow, kind: PunchKind, actor: Principal, now: Date): void {
    if (actor.role !== 'technician') return;
    if (kind === 'job-off') return this.access.assertMayWork(line, actor, now);
    if (line.technicianId === actor.id) return;
    if (line.technicianId !== null)
      throw new ForbiddenException('That line is assigned to someone else: ask the foreman');
    if (!this.shop.settings().techniciansTakeUnassigned)
      throw new ForbiddenException('The foreman assigns unassigned lines here: ask the foreman');
  }

  private technicianFor(body: CreatePunchBody, actor: Principal): number {
    if (actor.role === 'technician') {
      if (body.technicianId !== undefined && body.technicianId !== actor.id)
        throw new ForbiddenException('A technician punches only for themself');
      return actor.id;
    }
    if (body.technicianId === undefined) throw new BadRequestException('Say which technician (technicianId)');
    const tech = this.db
      .select()
      .from(users)
      .where(and(eq(users.id, body.technicianId), eq(users.role, 'technician')))
      .get();
    if (!tech || !tech.active) throw new BadRequestException('No active technician with that id');
    return tech.id;
  }
}

/** The statements of every punch, prepared once: built per call, each costs about 0.2 ms more. */
function preparePunchQueries(db: Db) {
  const value = (name: string) => sql.placeholder(name);
  return {
    punch: db
      .select()
      .from(punches)
      .where(eq(punches.id, value('id')))
      .prepare(),
    line: db
      .select()
      .from(jobLines)
      .where(eq(jobLines.id, value('id')))
      .prepare(),
    heldPunch: db
      .select()
      .from(heldPunches)
      .where(eq(heldPunches.id, value('id')))
      .prepare(),
    pendingOf: db
      .select()
      .from(heldPunches)
      .where(and(eq(heldPunches.technicianId, value('technicianId')), eq(heldPunches.review, 'pending')))
      .prepare(),
  };
}
