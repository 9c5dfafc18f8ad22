import { Inject, Injectable } from '@nestjs/common';
import { and, count, desc, eq, inArray } from 'drizzle-orm';
import { randomBytes } from 'node:crypto';
import type {
  CreatedWebhook,
  CreateWebhookBody,
  Page,
  PageQuery,
  WebhookDeliveryDto,
  WebhookDto,
} from '@baytime/shared';
import { AuditService } from '../audit/audit.service.js';
import type { Principal } from '../auth/principal.js';
import { foundOrFail } from '../common/not-found.js';
import { decodeCursor, olderThan, toPage } from '../common/paging.js';
import { DB, type Db } from '../db/database.js';
import { webhookAttempts, webhookDeliveries, webhooks } from '../db/schema/index.js';
import { Transactional, UnitOfWork } from '../db/unit-of-work.js';

type WebhookRow = typeof webhooks.$inferSelect;

/** The owner's webhook endpoints and the log of every delivery attempt. */
@Injectable()
export class WebhooksService {
  constructor(
    @Inject(DB) private readonly db: Db,
    readonly uow: UnitOfWork,
    private readonly audit: AuditService,
  ) {}

  list(): WebhookDto[] {
    return this.db.select().from(webhooks).orderBy(desc(webhooks.id)).all().map(toDto);
  }

  @Transactional()
  create(body: CreateWebhookBody, actor: Principal, now = new Date()): CreatedWebhook {
    const secret = `whsec_${randomBytes(32).toString('base64url')}`;
    const row = this.db
      .insert(webhooks)
      .values({ url: body.url, events: body.events, secret, createdBy: actor.id, createdAt: now })
      .returning()
      .get();
    this.audit.record({
      actorId: actor.id,
      action: 'create',
      entity: 'webhook',
      entityId: row.id,
      detail: { url: row.url, events: row.events },
    });
    return { webhook: toDto(row), secret };
  }

  /**
   * Sends nothing more to the endpoint, pending deliveries included: an endpoint is stopped when its
   * address is wrong or no longer trusted, and a retry would still reach it.
   */
  @Transactional()
  revoke(id: number, actor: Principal, now = new Date()): WebhookDto {
    const row = foundOrFail(this.db.select().from(webhooks).where(eq(webhooks.id, id)).get(), 'Webhook');
    if (row.revokedAt) return toDto(row);
    const revoked = this.db
      .update(webhooks)
      .set({ revokedAt: now })
      .where(eq(webhooks.id, id))
      .returning()
      .get()!;
    const cancelled = this.db
      .update(webhookDeliveries)
      .set({ status: 'cancelled', nextAttemptAt: null })
      .where(and(eq(webhookDeliveries.webhookId, id), eq(webhookDeliveries.status, 'pending')))
      .run().changes;
    this.audit.record({
      actorId: actor.id,
      action: 'revoke',
      entity: 'webhook',
      entityId: id,
      detail: { url: row.url, cancelledDeliveries: cancelled },
    });
    return toDto(revoked);
  }

  /** Newest first, each with its attempts. */
  deliveries(query: PageQuery): Page<WebhookDeliveryDto> {
    const total = this.db.select({ n: count() }).from(webhookDeliveries).get()?.n ?? 0;
    const rows = this.db
      .select({ delivery: webhookDeliveries, url: webhooks.url })
      .from(webhookDeliveries)
      .innerJoin(webhooks, eq(webhooks.id, webhookDeliveries.webhookId))
      .where(olderThan(webhookDeliveries.createdAt, webhookDeliveries.id, decodeCursor(query.cursor)))
      .orderBy(desc(webhookDeliveries.createdAt), desc(webhookDeliveries.id))
      .limit(query.limit + 1)
      .all();
    return toPage(
      rows,
      query.limit,
      total,
      ({ delivery }) => ({ at: delivery.createdAt.getTime(), id: delivery.id }),
      (shown) => {
        const attempts = shown.length
          ? this.db
              .select()
              .from(webhookAttempts)
              .where(
                inArray(
                  webhookAttempts.deliveryId,
                  shown.map(({ delivery }) => delivery.id),
                ),
              )
              .orderBy(webhookAttempts.id)
              .all()
          : [];
        return shown.map(({ delivery, url }) => ({
          id: delivery.id,
          webhookId: delivery.webhookId,
          url,
          event: delivery.event,
          status: delivery.status,
          attempts: attempts
            .filter((attempt) => attempt.deliveryId === delivery.id)
            .map((attempt) => ({
              at: attempt.at.toISOString(),
              status: attempt.status,
              error: attempt.error,
              durationMs: attempt.durationMs,
            })),
          nextAttemptAt: delivery.nextAttemptAt?.toISOString() ?? null,
          createdAt: delivery.createdAt.toISOString(),
        }));
      },
    );
  }
}

function toDto(row: WebhookRow): WebhookDto {
  return {
    id: row.id,
    url: row.url,
    events: row.events,
    createdAt: row.createdAt.toISOString(),
    revokedAt: row.revokedAt?.toISOString() ?? null,
  };
}
