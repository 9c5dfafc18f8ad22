import { BadRequestException, ConflictException, Inject, Injectable } from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { and, eq, ne } from 'drizzle-orm';
import {
  buildLedger,
  punchImpact,
  wholeSeconds,
  type CorrectionBody,
  type CorrectionPreview,
  type LedgerPunch,
  type PunchDto,
  type PunchImpact,
  type VoidPunchBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { referencedOrFail } from '../common/not-found.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { jobLines, punches, users } from '../db/schema/index.js';
import { toPunchDto } from '../labour/labour.service.js';
import { ClosedWeeksService } from '../payroll/closed-weeks.service.js';
import { counts } from '../punches/last-shift-out.js';
import { PunchLedgerService } from '../punches/punch-ledger.service.js';
import { PunchesService } from '../punches/punches.service.js';
import { ShopService } from '../shop/shop.service.js';

/** What a change to the card would write, and what it would do to the counted punches. */
interface Plan {
  /** The technician's counted punches around it, as read. */
  existing: LedgerPunch[];
  /** The rows it writes, the punch asked for last. */
  added: LedgerPunch[];
  impact: PunchImpact;
  /** The punch it replaces or takes out, if any. */
  replaced: LedgerPunch[];
}

/** The lines of the clock-ons among `punches`. */
const clockOnLines = (punches: readonly LedgerPunch[]) =>
  punches.flatMap((punch) => (punch.kind === 'job-on' && punch.jobLineId !== null ? [punch.jobLineId] : []));

/**
 * The foreman's and owner's changes to a timecard: a punch replaced, a missed one added, a wrong one taken
 * out. Each is previewed first; one that would make other counted punches impossible is saved only with
 * those punches named (`displaces`, as the preview showed them), and they are then voided with its reason.
 */
@Injectable()
export class CorrectionsService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly shop: ShopService,
    private readonly audit: AuditService,
    private readonly punches: PunchesService,
    private readonly ledger: PunchLedgerService,
    private readonly closedWeeks: ClosedWeeksService,
  ) {}

  /** What a correction would do, saving nothing: why it cannot be saved, or the punches it would displace. */
  preview(body: CorrectionBody, now = new Date()): CorrectionPreview {
    return this.previewOf(this.plan(body, now), body.technicianId, now);
  }

  /** What taking a punch out would do, saving nothing. */
  previewVoid(body: VoidPunchBody, now = new Date()): CorrectionPreview {
    return this.previewOf(this.planVoid(body, now), body.technicianId, now);
  }

  /**
   * A correction: a new punch with who, when and why. With `punchId` it supersedes that punch (which stays
   * on record); without, it adds a missed punch.
   */
  @Transactional()
  correct(body: CorrectionBody, actor: Principal, now = new Date()): PunchDto {
    const { added, impact, replaced } = this.plan(body, now);
    this.assertConfirmed('That correction', impact, body);
    const punch = added
      .map((each) => this.ledger.insert(each, { at: now, by: actor.id, reason: body.reason }))
      .at(-1)!;
    const voided = this.ledger.voidDisplaced(
      impact.displaced,
      actor,
      `Displaced by a correction: ${body.reason}`,
      now,
    );
    if (body.kind === 'job-on' && body.jobLineId)
      this.punches.startWork(body.jobLineId, body.technicianId, actor, now);
    this.punches.returnUnworked(clockOnLines([...replaced, ...impact.displaced]), now);
    this.audit.record({
      actorId: actor.id,
      action: body.punchId ? 'correct' : 'add-missed',
      entity: 'punch',
      entityId: punch.id,
      detail: {
        supersedes: body.punchId ?? null,
        kind: body.kind,
        at: body.at,
        reason: body.reason,
        ...(voided.length ? { voided } : {}),
      },
    });
    return punch;
  }

  /**
   * A punch that should never have been made is taken out of the count, with no punch in its place: a
   * voiding row supersedes it (both stay on record), audited with the reason. Answers the voiding row.
   */
  @Transactional()
  void(body: VoidPunchBody, actor: Principal, now = new Date()): PunchDto {
    const { added, impact, replaced } = this.planVoid(body, now);
    this.assertConfirmed('Taking that punch out', impact, body);
    const rows = added.map((each) =>
      this.ledger.insert(each, { at: now, by: actor.id, reason: body.reason, voids: true }),
    );
    const voiding = rows.at(-1)!;
    const withIt = rows.slice(0, -1);
    const voided = this.ledger.voidDisplaced(
      impact.displaced,
      actor,
      `Displaced by a punch taken out: ${body.reason}`,
      now,
    );
    this.punches.returnUnworked(clockOnLines([...replaced, ...impact.displaced]), now);
    this.audit.record({
      actorId: actor.id,
      action: 'void',
      entity: 'punch',
      entityId: body.punchId,
      detail: {
        voidedBy: voiding.id,
        kind: voiding.kind,
        at: voiding.at,
        reason: body.reason,
        ...(withIt.length ? { withIt: withIt.map((row) => row.supersedes) } : {}),
        ...(voided.length ? { voided } : {}),
      },
    });
    return voiding;
  }

  private previewOf({ existing, added, impact }: Plan, technicianId: number, now: Date): CorrectionPreview {
    return {
      change: this.changeOf(existing, added, impact.displaced, now),
      refusal: impact.refusal && this.ledger.refusalFor(impact.refusal, technicianId, null),
      displaces: this.ledger.describe(impact.displaced),
      // A voiding row is named by the punch it takes out.
      withIt: this.ledger.describe(
        added.slice(0, -1).map((row) => (row.voids ? { ...row, id: row.supersedes! } : row)),
      ),
    };
  }

  /** The counted time around the change before and after it, its displaced punches voided with it. */
  private changeOf(
    existing: LedgerPunch[],
    added: LedgerPunch[],
    displaced: LedgerPunch[],
    now: Date,
  ): CorrectionPreview['change'] {
    const settings = this.shop.ledgerSettings(now);
    const counted = (punches: LedgerPunch[]) => buildLedger(punches, now, settings).within(new Date(0), now);
    const voided = displaced.map((punch) => ({
      ...punch,
      id: `${punch.id}:void`,
      supersedes: punch.id,
      voids: true,
    }));
    const [was, will] = [counted(existing), counted([...existing, ...added, ...voided])];
    return {
      attendanceSeconds: wholeSeconds(will.attendanceSeconds - was.attendanceSeconds),
      clockedSeconds: wholeSeconds(will.clockedSeconds - was.clockedSeconds),
    };
  }

  /** A change is saved only when it fits, and with exactly the displaced punches its preview showed. */
  private assertConfirmed(
    what: string,
    impact: PunchImpact,
    body: { technicianId: number; displaces?: string[] | undefined },
  ): void {
    if (impact.refusal)
      throw new ConflictException(
        `${what} does not fit the timecard: ${this.ledger.refusalFor(impact.refusal, body.technicianId, null)}`,
      );
    const confirmed = new Set(body.displaces ?? []);
    if (
      impact.displaced.length === confirmed.size &&
      impact.displaced.every((punch) => confirmed.has(punch.id))
    )
      return;
    throw new ConflictException(
      impact.displaced.length > 0
        ? this.punches
            .displacementWords(what, impact)
            .replace('ask the foreman to correct the timecard', 'check them in the preview and confirm')
        : `${what} displaces no punch any more: save it again without the confirmation`,
    );
  }

  /** The checks every correction passes, and what it would do to the counted punches. */
  private plan(body: CorrectionBody, now: Date): Plan {
    const at = new Date(body.at);
    if (at > now) throw new BadRequestException('A correction cannot be in the future');
    this.assertTechnician(body.technicianId);
    const replaced = body.punchId
      ? this.replaceable(body.punchId, body.technicianId, 'The punch it corrects')
      : undefined;
    this.closedWeeks.assertOpenAt(at, 'That correction');
    if (body.jobLineId)
      this.ledger.assertLineExistedAt(
        referencedOrFail(
          this.db.select().from(jobLines).where(eq(jobLines.id, body.jobLineId)).get(),
          'job line',
        ),
        at,
      );
    const candidate: LedgerPunch = {
      id: randomUUID(),
      technicianId: body.technicianId,
      kind: body.kind,
      jobLineId: body.jobLineId ?? null,
      // A break of no stated kind counts as paid rest, never as an unpaid meal (29 CFR 785.18).
      breakKind: body.kind === 'break-start' ? (body.breakKind ?? null) : null,
      at: at.toISOString(),
      supersedes: body.punchId ?? null,
    };
    const existing = this.ledger.around(body.technicianId, at);
    return this.impactOf(
      existing,
      this.ledger.withJobOffs(existing, candidate),
      replaced ? [replaced] : [],
      now,
    );
  }

  /** The punch voided, with the clock-offs its clock-on recorded for the lines it closed (they go with it). */
  private planVoid(body: VoidPunchBody, now: Date): Plan {
    this.assertTechnician(body.technicianId);
    const original = this.replaceable(body.punchId, body.technicianId, 'That punch');
    if (original.voids) throw new BadRequestException('That row takes a punch out: correct the punch itself');
    const voiding = ({ id, technicianId, kind, jobLineId, breakKind, at }: PunchDto): LedgerPunch => ({
      id: randomUUID(),
      technicianId,
      kind,
      jobLineId,
      breakKind,
      at,
      supersedes: id,
      voids: true,
    });
    const existing = this.ledger.around(original.technicianId, new Date(original.at));
    return this.impactOf(existing, [...this.impliedBy(original), original].map(voiding), [original], now);
  }

  /** Clock-offs recorded with a clock-on, at its instant, for the lines it closed at the jobs-at-once limit. */
  private impliedBy(punch: PunchDto): PunchDto[] {
    if (punch.kind !== 'job-on') return [];
    return this.db
      .select()
      .from(punches)
      .where(
        and(
          eq(punches.technicianId, punch.technicianId),
          eq(punches.kind, 'job-off'),
          eq(punches.at, new Date(punch.at)),
          eq(punches.recordedAt, new Date(punch.recordedAt)),
          eq(punches.recordedBy, punch.recordedBy),
          ne(punches.jobLineId, punch.jobLineId!),
          counts('punches'),
        ),
      )
      .all()
      .map(toPunchDto);
  }

  private impactOf(existing: LedgerPunch[], added: LedgerPunch[], replaced: LedgerPunch[], now: Date): Plan {
    return { existing, added, impact: punchImpact(existing, added, this.shop.ledgerSettings(now)), replaced };
  }

  /** A counted punch of this technician, in an open week, that no later record replaced yet. */
  private replaceable(punchId: string, technicianId: number, what: string): PunchDto {
    const original = toPunchDto(
      referencedOrFail(this.db.select().from(punches).where(eq(punches.id, punchId)).get(), 'punch'),
    );
    if (original.technicianId !== technicianId)
      throw new BadRequestException('That punch belongs to another technician');
    const newer = this.db.select().from(punches).where(eq(punches.supersedes, punchId)).get();
    if (newer) throw new ConflictException('That punch was already corrected: correct the newer record');
    this.closedWeeks.assertOpenAt(new Date(original.at), what);
    return original;
  }

  private assertTechnician(technicianId: number): void {
    referencedOrFail(
      this.db
        .select()
        .from(users)
        .where(and(eq(users.id, technicianId), eq(users.role, 'technician')))
        .get(),
      'technician',
    );
  }
}
