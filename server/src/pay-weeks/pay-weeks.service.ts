import { ConflictException, Inject, Injectable } from '@nestjs/common';
import { eq } from 'drizzle-orm';
import { workweekName, type PayWeekState, type ReopenWeekBody } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { AuditService } from '../audit/audit.service.js';
import { DB, type Db } from '../db/database.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';
import { payWeeks, users } from '../db/schema/index.js';
import { ClosedWeeksService } from '../payroll/closed-weeks.service.js';
import { PaySummaryService } from '../reports/pay-summary.service.js';
import { boundsOf } from '../reports/week-figures.service.js';
import { ShopService } from '../shop/shop.service.js';
import { WebhookOutbox } from '../webhooks/webhook-outbox.service.js';

/**
 * Closing a pay week keeps its pay summary (figures and the rates used) as it stands: what payroll is given.
 * From then on nothing dated inside it can change (punches, corrections, line completions and a workweek that
 * would move it answer 409), and a line changed later shows as an adjustment in the first open week.
 * Reopening is the owner's, with a reason, audited; the figures first closed stay, so closing the week again
 * pays only the difference, carried to the first open week like any later change.
 */
@Injectable()
export class PayWeeksService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly shop: ShopService,
    private readonly paySummary: PaySummaryService,
    private readonly closedWeeks: ClosedWeeksService,
    private readonly audit: AuditService,
    private readonly webhooks: WebhookOutbox,
  ) {}

  @Transactional()
  close(week: string, actor: Principal, now = new Date()): PayWeekState {
    const settings = this.shop.settings(now);
    if (boundsOf(week, settings).to > now)
      throw new ConflictException('That week has not ended yet: close it once it is over');
    if (this.closedWeeks.closed(week)) throw new ConflictException('That week is already closed');
    const { report, lineIds } = this.paySummary.live(week, settings, now);
    if (report.unresolvedExceptions > 0)
      throw new ConflictException(
        `That week has ${report.unresolvedExceptions} unresolved exception(s): deal with them on the exceptions list first`,
      );
    const paid = this.db.select().from(payWeeks).where(eq(payWeeks.week, week)).get();
    const values = {
      closedAt: now,
      closedBy: actor.id,
      ...(paid?.snapshot && paid.paidAt
        ? { snapshot: paid.snapshot, paidAt: paid.paidAt }
        : { snapshot: { report, lineIds }, paidAt: now }),
    };
    this.db
      .insert(payWeeks)
      .values({ week, ...values })
      .onConflictDoUpdate({ target: payWeeks.week, set: values })
      .run();
    this.audit.record(
      {
        actorId: actor.id,
        action: 'close',
        entity: 'pay-week',
        entityId: week,
        detail: { totalCents: report.totals.payableCents },
      },
      now,
    );
    const bounds = boundsOf(week, settings);
    this.webhooks.announcePayWeekClosed(
      { week, from: bounds.from.toISOString(), to: bounds.to.toISOString() },
      now,
    );
    return this.state(week);
  }

  @Transactional()
  reopen(week: string, { reason }: ReopenWeekBody, actor: Principal, now = new Date()): PayWeekState {
    if (!this.closedWeeks.closed(week)) throw new ConflictException('That week is not closed');
    this.db
      .update(payWeeks)
      .set({
        closedAt: null,
        closedBy: null,
        reopenedAt: now,
        reopenedBy: actor.id,
        reopenReason: reason,
      })
      .where(eq(payWeeks.week, week))
      .run();
    this.audit.record(
      { actorId: actor.id, action: 'reopen', entity: 'pay-week', entityId: week, detail: { reason } },
      now,
    );
    return this.state(week);
  }

  private state(week: string): PayWeekState {
    const row = this.db.select().from(payWeeks).where(eq(payWeeks.week, week)).get();
    const name = (id: number | null | undefined) =>
      id
        ? (this.db.select({ name: users.name }).from(users).where(eq(users.id, id)).get()?.name ?? null)
        : null;
    return {
      week,
      weekName: workweekName(week, this.shop.settings()),
      closed: Boolean(row?.closedAt),
      closedAt: row?.closedAt?.toISOString() ?? null,
      closedBy: name(row?.closedBy),
      reopenedAt: row?.reopenedAt?.toISOString() ?? null,
      reopenReason: row?.reopenReason ?? null,
    };
  }
}
