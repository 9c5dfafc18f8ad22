import { BadRequestException, Inject, Injectable } from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { and, asc, eq, gte, inArray, lt, sql } from 'drizzle-orm';
import {
  PUNCH_WORDS,
  formatDayClockTime,
  inSentence,
  jobOffsWith,
  refusalAbout,
  MAX_PUNCH_CLOCK_SKEW_SECONDS,
  type DisplacedPunch,
  type LedgerPunch,
  type PunchDto,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { DB, type Db } from '../db/database.js';
import { jobLines, punches, repairOrders, users } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { toPunchDto } from '../labour/labour.service.js';
import { LiveService } from '../live/live.service.js';
import { ShopService } from '../shop/shop.service.js';
import { prepareReadFrom } from './last-shift-out.js';

/** Punches read around a late or corrected one: at least this long either side of it. */
const CONTEXT_MS = 36 * 3600_000;

/** Writes punches and names them in plain words; shared by the kiosk's punches and the foreman's corrections. */
@Injectable()
export class PunchLedgerService {
  private readonly insertStatement: ReturnType<typeof prepareInsert>;
  private readonly readFrom: ReturnType<typeof prepareReadFrom>;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly floor: FloorService,
    private readonly live: LiveService,
    private readonly shop: ShopService,
    private readonly audit: AuditService,
  ) {
    this.insertStatement = prepareInsert(db);
    this.readFrom = prepareReadFrom(db);
  }

  /**
   * A technician's counted punches within 36 h either side of `at`, from the database, and further back to
   * the shift-out before the shift open at `at` when it began longer ago than that.
   */
  around(technicianId: number, at: Date): LedgerPunch[] {
    const from = this.readFrom(technicianId, at.getTime(), CONTEXT_MS);
    return this.db
      .select()
      .from(punches)
      .where(
        and(
          eq(punches.technicianId, technicianId),
          gte(punches.at, new Date(from)),
          lt(punches.at, new Date(at.getTime() + CONTEXT_MS)),
        ),
      )
      .orderBy(asc(punches.at))
      .all()
      .map(toPunchDto);
  }

  /**
   * `punch` with the job-offs it implies (`jobOffsWith`): a clock-on at the shop's jobs-at-once limit of
   * its moment closes the oldest open line, on record, so a later change of the limit leaves the past as it
   * was counted; one dated before later clock-ons is closed by them as the lines open then were.
   */
  withJobOffs(existing: readonly LedgerPunch[], punch: LedgerPunch): LedgerPunch[] {
    const offs = jobOffsWith(existing, punch, (at) => this.shop.jobsAtOnceAt(at));
    return [
      ...offs.map((off) => ({
        id: randomUUID(),
        technicianId: punch.technicianId,
        kind: 'job-off' as const,
        jobLineId: off.jobLineId,
        breakKind: null,
        at: off.at,
        supersedes: null,
      })),
      punch,
    ];
  }

  /**
   * No one is clocked on a line before it was written: such a punch (a correction dated back, a tablet
   * whose clock ran far behind) would count time the reports of that week cannot place on the line.
   */
  assertLineExistedAt(line: { queuedAt: Date }, at: Date): void {
    if (at.getTime() >= line.queuedAt.getTime() - MAX_PUNCH_CLOCK_SKEW_SECONDS * 1000) return;
    const { timeZone, clockFormat } = this.shop.settings();
    throw new BadRequestException(
      `That line was added at ${formatDayClockTime(line.queuedAt.toISOString(), timeZone, clockFormat)}: no one can be clocked on it before then`,
    );
  }

  /** A punch refused in the words for who asked: "You are …" to the technician, their name to anyone else. */
  refusalFor(refusal: string, technicianId: number, askedBy: number | null): string {
    if (askedBy === technicianId) return refusal;
    const name = this.db
      .select({ name: users.name })
      .from(users)
      .where(eq(users.id, technicianId))
      .get()?.name;
    return name ? refusalAbout(refusal, name) : refusal;
  }

  /** "the clock on at Tue, Dec 1, 3:10 pm (RO 4410 · Replace water pump)", for each punch. */
  describe(list: readonly LedgerPunch[]): DisplacedPunch[] {
    const { timeZone } = this.shop.settings();
    const lineIds = [...new Set(list.map((p) => p.jobLineId).filter((id) => id !== null))];
    const lines = new Map(
      (lineIds.length
        ? this.db
            .select({ id: jobLines.id, title: jobLines.title, number: repairOrders.number })
            .from(jobLines)
            .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
            .where(inArray(jobLines.id, lineIds))
            .all()
        : []
      ).map((line) => [line.id, `RO ${line.number} · ${line.title}`]),
    );
    return list.map((punch) => {
      const line = punch.jobLineId === null ? undefined : lines.get(punch.jobLineId);
      const when = formatDayClockTime(punch.at, timeZone, this.shop.settings().clockFormat);
      return {
        id: punch.id,
        kind: punch.kind,
        at: punch.at,
        words: `the ${inSentence(PUNCH_WORDS[punch.kind])} at ${when}${line ? ` (${line})` : ''}`,
      };
    });
  }

  /** "the clock on at Tue, Dec 1, 3:10 pm (…) and the shift end at Tue, Dec 1, 5:00 pm". */
  listInWords(list: readonly LedgerPunch[]): string {
    const words = this.describe(list).map((punch) => punch.words);
    return words.length > 1 ? `${words.slice(0, -1).join(', ')} and ${words.at(-1)}` : (words[0] ?? '');
  }

  /** Stores a punch, tells the wall and the floor model once the use case commits. */
  insert(
    punch: LedgerPunch,
    recorded: { at: Date; by: number; reason?: string | null; voids?: boolean },
  ): PunchDto {
    const row = this.insertStatement.get({
      ...punch,
      at: new Date(punch.at),
      recordedAt: recorded.at,
      recordedBy: recorded.by,
      reason: recorded.reason ?? null,
      voids: recorded.voids ?? false,
    });
    const dto = toPunchDto(row!);
    this.live.publish('punch.recorded', { punch: dto }, { to: 'floor', technicianIds: [dto.technicianId] });
    this.floor.punchRecorded(dto);
    return dto;
  }

  /**
   * Takes counted punches out of the count once a person decided so (a held punch accepted, a correction
   * confirmed): each gets a voiding row that supersedes it, recorded by them with the reason, and audited.
   */
  voidDisplaced(displaced: readonly LedgerPunch[], actor: Principal, reason: string, now: Date): string[] {
    return displaced.map((punch) => {
      const voiding = this.insert(
        { ...punch, id: randomUUID(), supersedes: punch.id },
        { at: now, by: actor.id, reason, voids: true },
      );
      this.audit.record(
        {
          actorId: actor.id,
          action: 'void',
          entity: 'punch',
          entityId: punch.id,
          detail: { voidedBy: voiding.id, kind: punch.kind, at: punch.at, reason },
        },
        now,
      );
      return punch.id;
    });
  }
}

/** The insert of every punch, prepared once: built per call, it costs about 0.2 ms more. */
function prepareInsert(db: Db) {
  const value = (name: string) => sql.placeholder(name);
  return db
    .insert(punches)
    .values({
      id: value('id'),
      technicianId: value('technicianId'),
      kind: value('kind'),
      jobLineId: value('jobLineId'),
      breakKind: value('breakKind'),
      at: value('at'),
      recordedAt: value('recordedAt'),
      recordedBy: value('recordedBy'),
      supersedes: value('supersedes'),
      reason: value('reason'),
      voids: value('voids'),
    })
    .returning()
    .prepare();
}
