import {
  Inject,
  Injectable,
  Logger,
  type OnApplicationBootstrap,
  type OnModuleDestroy,
} from '@nestjs/common';
import { and, asc, eq, lte } from 'drizzle-orm';
import type { Transporter } from 'nodemailer';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { DB, type Db } from '../db/database.js';
import { mailOutbox, users } from '../db/schema/index.js';
import { ShopService } from '../shop/shop.service.js';
import { MailboxService } from './mailbox.service.js';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  /** Files on the server's disk, sent as attachments. */
  attachments?: { filename: string; path: string }[];
}

export type OutboxRow = typeof mailOutbox.$inferSelect;

/** After this many failed attempts a message is marked `failed` and left alone. */
export const MAX_MAIL_ATTEMPTS = 8;
const FIRST_RETRY_MS = 60_000;
const SEND_EVERY_MS = 15_000;
const BATCH = 25;

/** Exponential back-off: 1, 2, 4 … 64 minutes after the 1st … 7th failed attempt. */
export function retryDelayMs(failedAttempts: number): number {
  return FIRST_RETRY_MS * 2 ** Math.max(0, failedAttempts - 1);
}

/**
 * An outbox in SQLite: `queue` stores a message and returns at once; a background loop sends what is
 * due over SMTP and retries failures with back-off. A queued row outlives a restart, so a message is
 * sent at least once even if the server stops before it went out.
 */
@Injectable()
export class MailService implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('Mail');
  /** Connected after start-up: nodemailer and the local mailbox load while the server already answers. */
  private transport: Promise<Transporter> | null = null;
  private timer: NodeJS.Timeout | null = null;
  private chain: Promise<unknown> = Promise.resolve();
  private pendingFlushes = 0;
  private stopped = false;

  constructor(
    @Inject(DB) private readonly db: Db,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly shop: ShopService,
    private readonly mailbox: MailboxService,
  ) {}

  onApplicationBootstrap(): void {
    this.transport = this.connect();
    this.transport.catch((error: unknown) => this.logger.error(`Mail cannot be sent: ${String(error)}`));
    this.timer = setInterval(() => this.kick(), SEND_EVERY_MS);
    this.timer.unref();
    this.kick();
  }

  async onModuleDestroy(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    await this.chain;
    (await this.transport?.catch(() => null))?.close();
    await this.mailbox.stop();
  }

  queue(mail: OutgoingMail, now = new Date()): OutboxRow {
    const row = this.db
      .insert(mailOutbox)
      .values({
        recipient: mail.to,
        subject: mail.subject,
        text: mail.text,
        attachments: mail.attachments ?? [],
        status: 'queued',
        nextAttemptAt: now,
        createdAt: now,
      })
      .returning()
      .get();
    this.kick();
    return row;
  }

  find(id: number): OutboxRow | undefined {
    return this.db.select().from(mailOutbox).where(eq(mailOutbox.id, id)).get();
  }

  /** Sends every queued message due at `now` (one flush at a time); answers how many went out. */
  flush(now?: Date): Promise<number> {
    this.pendingFlushes++;
    const run = this.chain.then(() => this.sendDue(now ?? new Date())).finally(() => this.pendingFlushes--);
    this.chain = run.catch(() => undefined);
    return run;
  }

  /** One flush running and one waiting is enough to pick up everything queued meanwhile. */
  private kick(): void {
    if (this.stopped || !this.transport || this.pendingFlushes > 1) return;
    this.flush().catch((error: unknown) => this.logger.error(`Sending mail failed: ${String(error)}`));
  }

  private async connect(): Promise<Transporter> {
    const server = this.config.smtpUrl
      ? { url: this.config.smtpUrl }
      : { host: '127.0.0.1', port: await this.mailbox.start(), secure: false, ignoreTLS: true };
    const { createTransport } = await import('nodemailer');
    return createTransport({
      ...server,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
  }

  private async sendDue(now: Date): Promise<number> {
    const transport = await this.transport?.catch(() => null);
    if (!transport || this.stopped) return 0;
    const due = this.db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.status, 'queued'), lte(mailOutbox.nextAttemptAt, now)))
      .orderBy(asc(mailOutbox.nextAttemptAt), asc(mailOutbox.id))
      .limit(BATCH)
      .all();
    if (!due.length) return 0;
    const from = this.sender();
    let sent = 0;
    for (const mail of due) {
      if (this.stopped) break;
      try {
        await transport.sendMail({
          from,
          to: mail.recipient,
          subject: mail.subject,
          text: mail.text,
          attachments: mail.attachments ?? [],
        });
        this.db
          .update(mailOutbox)
          .set({ status: 'sent', attempts: mail.attempts + 1, sentAt: now, lastError: null })
          .where(eq(mailOutbox.id, mail.id))
          .run();
        sent++;
      } catch (error) {
        const attempts = mail.attempts + 1;
        const failed = attempts >= MAX_MAIL_ATTEMPTS;
        const reason = error instanceof Error ? error.message : String(error);
        this.db
          .update(mailOutbox)
          .set({
            attempts,
            lastError: reason.slice(0, 500),
            status: failed ? 'failed' : 'queued',
            nextAttemptAt: failed ? mail.nextAttemptAt : new Date(now.getTime() + retryDelayMs(attempts)),
          })
          .where(eq(mailOutbox.id, mail.id))
          .run();
        this.logger.warn(
          `Mail ${mail.id} to ${mail.recipient} not sent (attempt ${attempts}): ${reason}` +
            (failed ? '; giving up' : ''),
        );
      }
    }
    return sent;
  }

  /** From the shop's name at its owner's address, so a reply reaches someone at the shop. */
  private sender(): { name: string; address: string } {
    const owner = this.db
      .select({ email: users.email })
      .from(users)
      .where(and(eq(users.role, 'owner'), eq(users.active, true)))
      .orderBy(asc(users.id))
      .all()
      .find((user) => user.email);
    return { name: this.shop.settings().name, address: owner?.email ?? 'baytime@localhost' };
  }
}
