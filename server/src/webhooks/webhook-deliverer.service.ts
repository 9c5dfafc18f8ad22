import {
  Inject,
  Injectable,
  Logger,
  type OnApplicationBootstrap,
  type OnModuleDestroy,
} from '@nestjs/common';
import { Interval } from '@nestjs/schedule';
import { and, asc, eq, isNull, lte } from 'drizzle-orm';
import { readFileSync } from 'node:fs';
import { request } from 'node:https';
import { rootCertificates } from 'node:tls';
import { retryDelayMs } from '@baytime/shared';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { DB, type Db } from '../db/database.js';
import { webhookAttempts, webhookDeliveries, webhooks } from '../db/schema/index.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import {
  DELIVERY_HEADER,
  EVENT_HEADER,
  SIGNATURE_HEADER,
  signWebhook,
  TIMESTAMP_HEADER,
} from './webhook-signature.js';

/** After this many tries (about a day and a half of back-off) a delivery is marked failed. */
export const MAX_WEBHOOK_ATTEMPTS = 12;
export const WEBHOOK_RETRY = { firstMs: 30_000, maxMs: 6 * 3600_000, jitter: true };
const SEND_EVERY_MS = 10_000;
const TIMEOUT_MS = 10_000;
const BATCH = 20;

type DeliveryRow = typeof webhookDeliveries.$inferSelect;

/** Still waiting, to an endpoint not stopped. */
const sendable = () => and(eq(webhookDeliveries.status, 'pending'), isNull(webhooks.revokedAt));

interface Answer {
  status: number | null;
  error: string | null;
}

/** Sends due deliveries over HTTPS, one batch at a time, and writes down every attempt. */
@Injectable()
export class WebhookDeliverer implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('Webhooks');
  /** Public CAs, plus the file BAYTIME_WEBHOOK_CA_FILE names (the tests' own CA); never "trust all". */
  private readonly ca: string[] | undefined;
  private chain: Promise<unknown> = Promise.resolve();
  private pending = 0;
  private started = false;
  private stopped = false;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
    @Inject(APP_CONFIG) config: AppConfig,
  ) {
    this.ca = config.webhookCaFile
      ? [...rootCertificates, readFileSync(config.webhookCaFile, 'utf8')]
      : undefined;
  }

  onApplicationBootstrap(): void {
    this.started = true;
    this.kick();
  }

  async onModuleDestroy(): Promise<void> {
    this.stopped = true;
    await this.chain;
  }

  /** Picks up what is due: deliveries left from before a restart, and retries whose wait is over. */
  @Interval(SEND_EVERY_MS)
  kick(): void {
    if (!this.started || this.stopped || this.pending > 1) return;
    this.flush().catch((error: unknown) => this.logger.error(`Delivering webhooks failed: ${String(error)}`));
  }

  /** Sends every delivery due at `now` (one flush at a time); answers how many were delivered. */
  flush(now?: Date): Promise<number> {
    this.pending++;
    const run = this.chain.then(() => this.sendDue(now ?? new Date())).finally(() => this.pending--);
    this.chain = run.catch(() => undefined);
    return run;
  }

  private async sendDue(now: Date): Promise<number> {
    const due = this.db
      .select({ delivery: webhookDeliveries, url: webhooks.url, secret: webhooks.secret })
      .from(webhookDeliveries)
      .innerJoin(webhooks, eq(webhooks.id, webhookDeliveries.webhookId))
      .where(and(sendable(), lte(webhookDeliveries.nextAttemptAt, now)))
      .orderBy(asc(webhookDeliveries.nextAttemptAt), asc(webhookDeliveries.id))
      .limit(BATCH)
      .all();
    let delivered = 0;
    for (const { delivery, url, secret } of due) {
      if (this.stopped) break;
      // The sends before this one took time: its endpoint may have been stopped meanwhile.
      if (!this.stillSendable(delivery.id)) continue;
      const started = Date.now();
      const answer = await this.post(url, secret, delivery);
      if (this.record(delivery, answer, new Date(started), Date.now() - started)) delivered++;
    }
    return delivered;
  }

  private stillSendable(deliveryId: number): boolean {
    return !!this.db
      .select({ id: webhookDeliveries.id })
      .from(webhookDeliveries)
      .innerJoin(webhooks, eq(webhooks.id, webhookDeliveries.webhookId))
      .where(and(eq(webhookDeliveries.id, deliveryId), sendable()))
      .get();
  }

  private post(url: string, secret: string, delivery: DeliveryRow): Promise<Answer> {
    const timestamp = Math.floor(Date.now() / 1000);
    return new Promise((resolve) => {
      const outgoing = request(
        url,
        {
          method: 'POST',
          ca: this.ca,
          timeout: TIMEOUT_MS,
          headers: {
            'content-type': 'application/json',
            'user-agent': 'Baytime-Webhooks',
            [EVENT_HEADER]: delivery.event,
            [DELIVERY_HEADER]: String(delivery.id),
            [TIMESTAMP_HEADER]: String(timestamp),
            [SIGNATURE_HEADER]: signWebhook(secret, timestamp, delivery.body),
          },
        },
        (response) => {
          response.resume();
          response.on('end', () => resolve({ status: response.statusCode ?? null, error: null }));
        },
      );
      outgoing.on('timeout', () => outgoing.destroy(new Error(`No answer within ${TIMEOUT_MS / 1000} s`)));
      outgoing.on('error', (error) => resolve({ status: null, error: error.message.slice(0, 300) }));
      outgoing.end(delivery.body);
    });
  }

  /** Writes the attempt and the delivery's new state together; true when the receiver took it. */
  private record(delivery: DeliveryRow, answer: Answer, at: Date, durationMs: number): boolean {
    const ok = answer.status !== null && answer.status >= 200 && answer.status < 300;
    const attempts = delivery.attempts + 1;
    const failed = !ok && attempts >= MAX_WEBHOOK_ATTEMPTS;
    const error = ok ? null : (answer.error ?? `The receiver answered ${answer.status}`);
    this.uow.run(() => {
      this.db
        .insert(webhookAttempts)
        .values({ deliveryId: delivery.id, at, status: answer.status, error, durationMs })
        .run();
      this.db
        .update(webhookDeliveries)
        .set({
          attempts,
          status: ok ? 'delivered' : failed ? 'failed' : 'pending',
          deliveredAt: ok ? at : null,
          nextAttemptAt: ok || failed ? null : new Date(at.getTime() + retryDelayMs(attempts, WEBHOOK_RETRY)),
        })
        // A delivery cancelled while its try was under way stays cancelled, unless that try got through.
        .where(
          and(
            eq(webhookDeliveries.id, delivery.id),
            ok ? undefined : eq(webhookDeliveries.status, 'pending'),
          ),
        )
        .run();
    });
    if (!ok)
      this.logger.warn(
        `Webhook delivery ${delivery.id} not taken (try ${attempts}): ${error}${failed ? '; giving up' : ''}`,
      );
    return ok;
  }
}
