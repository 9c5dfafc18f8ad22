import { Inject, Injectable } from '@nestjs/common';
import { isNull } from 'drizzle-orm';
import { randomUUID } from 'node:crypto';
import type { WebhookEnvelope, WebhookEvent, WebhookPayloads } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { webhookDeliveries, webhooks } from '../db/schema/index.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import { WebhookDeliverer } from './webhook-deliverer.service.js';

/**
 * Announces an event to every endpoint that asked for it. Call it inside the use case's transaction:
 * the deliveries are written with the change they announce, so none goes out for a change that rolled
 * back, and none is lost if the server stops before sending. Sending starts after the commit.
 */
@Injectable()
export class WebhookOutbox {
  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
    private readonly deliverer: WebhookDeliverer,
  ) {}

  announce<E extends WebhookEvent>(event: E, data: WebhookPayloads[E], now = new Date()): void {
    const listening = this.db
      .select({ id: webhooks.id, events: webhooks.events })
      .from(webhooks)
      .where(isNull(webhooks.revokedAt))
      .all()
      .filter((webhook) => webhook.events.includes(event));
    if (!listening.length) return;
    for (const webhook of listening) {
      const envelope: WebhookEnvelope<E> = { id: randomUUID(), event, occurredAt: now.toISOString(), data };
      this.db
        .insert(webhookDeliveries)
        .values({
          webhookId: webhook.id,
          event,
          body: JSON.stringify(envelope),
          nextAttemptAt: now,
          createdAt: now,
        })
        .run();
    }
    this.uow.afterCommit(() => this.deliverer.kick());
  }

  /**
   * For the pay-week close: call it from the close use case, inside its transaction. The payload
   * names the week and where its payroll CSV is read.
   */
  announcePayWeekClosed(week: { week: string; from: string; to: string }, closedAt = new Date()): void {
    this.announce(
      'pay-week.closed',
      {
        ...week,
        closedAt: closedAt.toISOString(),
        payrollCsvPath: `/api/pay-weeks/${week.week}/payroll.csv`,
      },
      closedAt,
    );
  }
}
