import { BadRequestException, Inject, Injectable } from '@nestjs/common';
import { and, asc, eq, gte, inArray, lt } from 'drizzle-orm';
import {
  buildLedger,
  EXCEPTION_KINDS,
  ledgerExceptions,
  type ExceptionKind,
  type ExceptionSettings,
  type Ledger,
  type LedgerException,
  type ReviewExceptionBody,
  type TimeException,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { exceptionReviews, heldPunches, jobLines, punches, repairOrders, users } from '../db/schema/index.js';
import { toPunchDto } from '../labour/labour.service.js';
import { ShopService } from '../shop/shop.service.js';

const HOUR_MS = 3600_000;

/** A week's ledgers, as the reports build them. */
export interface WeekLedgers {
  from: Date;
  to: Date;
  now: Date;
  ledgers: ReadonlyMap<number, Ledger>;
}

/** Kinds the foreman clears by marking them reviewed; the others clear through their own action. */
const REVIEWABLE: readonly ExceptionKind[] = ['open-shift', 'open-break', 'long-rest', 'short-meal'];

/**
 * The exceptions of a week, shop-wide: what the ledgers show, late punches held for review, and lines done
 * without clocked time. Each carries its resolution once someone dealt with it.
 */
@Injectable()
export class ExceptionsService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly shop: ShopService,
    private readonly audit: AuditService,
  ) {}

  collect({ from, to, now, ledgers }: WeekLedgers): TimeException[] {
    const settings = { ...this.shop.settings(now), ...this.shop.ledgerSettings(now) };
    const found: Omit<TimeException, 'technicianName' | 'resolution'>[] = [];
    for (const [technicianId, ledger] of ledgers)
      for (const exception of this.pastTheWeek(technicianId, ledger, { from, to, now, settings }))
        found.push({
          ...exception,
          technicianId,
          at: exception.at.toISOString(),
          punchId: null,
          jobLineId: null,
        });
    const names = new Map<number, string>();
    const people = (id: number) => names.get(id) ?? '?';
    for (const row of this.db.select({ id: users.id, name: users.name }).from(users).all())
      names.set(row.id, row.name);
    const resolutions = new Map<string, TimeException['resolution']>();

    for (const held of this.db
      .select()
      .from(heldPunches)
      .where(and(gte(heldPunches.at, from), lt(heldPunches.at, to)))
      .all()) {
      const key = `held-punch:${held.id}`;
      found.push({
        kind: 'held-punch',
        key,
        technicianId: held.technicianId,
        at: held.at.toISOString(),
        text: held.heldBecause,
        punchId: held.id,
        jobLineId: null,
      });
      if (held.review !== 'pending')
        resolutions.set(key, {
          by: people(held.resolvedBy ?? 0),
          at: held.resolvedAt!.toISOString(),
          note: `${held.review === 'accepted' ? 'Accepted' : 'Rejected'}: ${held.resolution ?? ''}`,
        });
    }

    for (const line of this.db
      .select({
        id: jobLines.id,
        title: jobLines.title,
        number: repairOrders.number,
        technicianId: jobLines.technicianId,
        completedAt: jobLines.completedAt,
        signOff: jobLines.signOff,
        signedOffBy: jobLines.signedOffBy,
        signedOffAt: jobLines.signedOffAt,
        reason: jobLines.signOffReason,
      })
      .from(jobLines)
      .innerJoin(repairOrders, eq(repairOrders.id, jobLines.repairOrderId))
      .where(
        and(
          inArray(jobLines.signOff, ['awaiting', 'signed']),
          gte(jobLines.completedAt, from),
          lt(jobLines.completedAt, to),
        ),
      )
      .all()) {
      const key = `done-unclocked:${line.id}`;
      found.push({
        kind: 'done-unclocked',
        key,
        technicianId: line.technicianId ?? 0,
        at: line.completedAt!.toISOString(),
        text: `RO ${line.number} · ${line.title} was marked done with less than ${settings.minimumClockedMinutesForDone} min clocked: its book hours are flagged only once a foreman signs it off`,
        punchId: null,
        jobLineId: line.id,
      });
      if (line.signOff === 'signed')
        resolutions.set(key, {
          by: people(line.signedOffBy ?? 0),
          at: line.signedOffAt!.toISOString(),
          note: `Signed off: ${line.reason ?? ''}`,
        });
    }

    const keys = found.filter((f) => REVIEWABLE.includes(f.kind)).map((f) => f.key);
    for (const review of keys.length
      ? this.db.select().from(exceptionReviews).where(inArray(exceptionReviews.key, keys)).all()
      : [])
      resolutions.set(review.key, {
        by: people(review.reviewedBy),
        at: review.reviewedAt.toISOString(),
        note: `Reviewed: ${review.note}`,
      });

    const order = (kind: ExceptionKind) => EXCEPTION_KINDS.indexOf(kind);
    return found
      .map((f) => ({
        ...f,
        technicianName: people(f.technicianId),
        resolution: resolutions.get(f.key) ?? null,
      }))
      .sort((a, b) => a.at.localeCompare(b.at) || order(a.kind) - order(b.kind));
  }

  /** The foreman checked a timecard exception and accepts it as it is: audited, with the note. */
  /**
   * A week's ledger ends with the week: a shift or break still open then may have ended after it (a night
   * shift across the week's end). Those are judged again on the punches that follow, up to the longest a
   * shift may run, so a shift-out the next week clears them.
   */
  private pastTheWeek(
    technicianId: number,
    ledger: Ledger,
    { from, to, now, settings }: { from: Date; to: Date; now: Date; settings: ExceptionSettings },
  ): LedgerException[] {
    const exceptions = ledgerExceptions(ledger, from, to, now, settings);
    const open = exceptions.filter((e) => e.kind === 'open-shift' || e.kind === 'open-break');
    const openShift = ledger.shifts.find((shift) => shift.open);
    if (open.length === 0 || !openShift || to >= now) return exceptions;
    // From the open shift's start, so its breaks are read inside it.
    const first = openShift.from;
    const until = new Date(Math.min(now.getTime(), to.getTime() + settings.longShiftHours * HOUR_MS));
    const punchesOn = this.db
      .select()
      .from(punches)
      .where(and(eq(punches.technicianId, technicianId), gte(punches.at, first), lt(punches.at, until)))
      .orderBy(asc(punches.at))
      .all()
      .map(toPunchDto);
    const later = ledgerExceptions(buildLedger(punchesOn, until, settings), from, to, now, settings);
    const startOf = (e: LedgerException) => e.key.slice(e.key.indexOf(':') + 1);
    const judgedAgain = new Set(open.map(startOf));
    return [
      ...exceptions.filter((e) => !judgedAgain.has(startOf(e))),
      ...later.filter((e) => judgedAgain.has(startOf(e))),
    ].sort((a, b) => a.at.getTime() - b.at.getTime());
  }

  @Transactional()
  review(body: ReviewExceptionBody, technicianId: number, actor: Principal, now = new Date()): void {
    const kind = body.key.split(':')[0] as ExceptionKind;
    if (!REVIEWABLE.includes(kind))
      throw new BadRequestException(
        'That exception clears through its own action (accept, reject, sign off)',
      );
    this.db
      .insert(exceptionReviews)
      .values({ key: body.key, technicianId, reviewedBy: actor.id, reviewedAt: now, note: body.note })
      .onConflictDoUpdate({
        target: exceptionReviews.key,
        set: { reviewedBy: actor.id, reviewedAt: now, note: body.note },
      })
      .run();
    this.audit.record(
      {
        actorId: actor.id,
        action: 'review',
        entity: 'exception',
        entityId: body.key,
        detail: { note: body.note },
      },
      now,
    );
  }
}
