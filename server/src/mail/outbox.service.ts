import {
  Inject,
  Injectable,
  Logger,
  type OnApplicationBootstrap,
  type OnModuleDestroy,
} from '@nestjs/common';
import { and, asc, eq, lte } from 'drizzle-orm';
import { DB, type Db } from '../db/database.js';
import { mailOutbox, type MessageChannel } from '../db/schema/index.js';
import { MailSender } from './mail-sender.js';
import { TextSender } from './text-sender.js';

/** Whether the body holds a secret, such as a customer's approval link: kept only until it is sent. */
interface SecretBody {
  secretBody?: boolean;
}

export interface OutgoingMail extends SecretBody {
  to: string;
  subject: string;
  text: string;
  /** Files on the server's disk, sent as attachments. */
  attachments?: { filename: string; path: string }[];
}

export interface OutgoingText extends SecretBody {
  /** A phone number in E.164. */
  to: string;
  body: string;
}

export type OutboxRow = typeof mailOutbox.$inferSelect;

/** After this many failed attempts a message is marked `failed` and left alone. */
export const MAX_SEND_ATTEMPTS = 8;
const FIRST_RETRY_MS = 60_000;
const SEND_EVERY_MS = 15_000;
const BATCH = 25;

/** Exponential back-off: 1, 2, 4 … 64 minutes after the 1st … 7th failed attempt. */
export function retryDelayMs(failedAttempts: number): number {
  return FIRST_RETRY_MS * 2 ** Math.max(0, failedAttempts - 1);
}

/**
 * An outbox in SQLite for every message the shop sends, e-mail or text: `queueMail` and `queueText`
 * store a message and return at once; a background loop hands what is due to its channel's sender
 * and retries failures with back-off. A queued row outlives a restart, so a message is sent at least
 * once even if the server stops before it went out.
 */
@Injectable()
export class OutboxService implements OnApplicationBootstrap, OnModuleDestroy {
  private readonly logger = new Logger('Outbox');
  private timer: NodeJS.Timeout | null = null;
  private chain: Promise<unknown> = Promise.resolve();
  private pendingFlushes = 0;
  private starting: Promise<void> = Promise.resolve();
  private started = false;
  private stopped = false;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly mail: MailSender,
    private readonly texts: TextSender,
  ) {}

  /** The senders start after start-up: the mail libraries load while the server already answers. */
  onApplicationBootstrap(): void {
    this.starting = Promise.all([this.mail.start(), this.texts.start()]).then(
      () => {
        this.started = true;
        this.kick();
      },
      (error: unknown) => this.logger.error(`Messages cannot be sent: ${String(error)}`),
    );
    this.timer = setInterval(() => this.kick(), SEND_EVERY_MS);
    this.timer.unref();
  }

  async onModuleDestroy(): Promise<void> {
    this.stopped = true;
    if (this.timer) clearInterval(this.timer);
    await this.starting;
    await this.chain;
    await this.mail.stop();
  }

  queueMail(mail: OutgoingMail, now = new Date()): OutboxRow {
    return this.queue('email', mail.to, mail.text, !!mail.secretBody, now, {
      subject: mail.subject,
      attachments: mail.attachments ?? [],
    });
  }

  queueText(text: OutgoingText, now = new Date()): OutboxRow {
    return this.queue('text', text.to, text.body, !!text.secretBody, now);
  }

  find(id: number): OutboxRow | undefined {
    return this.db.select().from(mailOutbox).where(eq(mailOutbox.id, id)).get();
  }

  /** Sends every queued message due at `now` (one flush at a time); answers how many went out. */
  flush(now?: Date): Promise<number> {
    this.pendingFlushes++;
    const run = this.chain
      .then(() => this.starting)
      .then(() => this.sendDue(now ?? new Date()))
      .finally(() => this.pendingFlushes--);
    this.chain = run.catch(() => undefined);
    return run;
  }

  private queue(
    channel: MessageChannel,
    recipient: string,
    text: string,
    secretBody: boolean,
    now: Date,
    mail: { subject: string; attachments: OutgoingMail['attachments'] } = { subject: '', attachments: [] },
  ): OutboxRow {
    const row = this.db
      .insert(mailOutbox)
      .values({
        channel,
        recipient,
        subject: channel === 'email' ? mail.subject : null,
        text,
        secretBody,
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

  /** One flush running and one waiting is enough to pick up everything queued meanwhile. */
  private kick(): void {
    if (this.stopped || !this.started || this.pendingFlushes > 1) return;
    this.flush().catch((error: unknown) => this.logger.error(`Sending messages failed: ${String(error)}`));
  }

  private async sendDue(now: Date): Promise<number> {
    if (!this.started || this.stopped) return 0;
    const due = this.db
      .select()
      .from(mailOutbox)
      .where(and(eq(mailOutbox.status, 'queued'), lte(mailOutbox.nextAttemptAt, now)))
      .orderBy(asc(mailOutbox.nextAttemptAt), asc(mailOutbox.id))
      .limit(BATCH)
      .all();
    let sent = 0;
    for (const message of due) {
      if (this.stopped) break;
      try {
        await (message.channel === 'text'
          ? this.texts.send(message.recipient, message.text)
          : this.mail.send(message));
        this.db
          .update(mailOutbox)
          .set({
            status: 'sent',
            attempts: message.attempts + 1,
            sentAt: now,
            lastError: null,
            ...(message.secretBody ? { text: '' } : {}),
          })
          .where(eq(mailOutbox.id, message.id))
          .run();
        sent++;
      } catch (error) {
        const attempts = message.attempts + 1;
        const failed = attempts >= MAX_SEND_ATTEMPTS;
        const reason = error instanceof Error ? error.message : String(error);
        this.db
          .update(mailOutbox)
          .set({
            attempts,
            lastError: reason.slice(0, 500),
            status: failed ? 'failed' : 'queued',
            nextAttemptAt: failed ? message.nextAttemptAt : new Date(now.getTime() + retryDelayMs(attempts)),
          })
          .where(eq(mailOutbox.id, message.id))
          .run();
        this.logger.warn(
          `${message.channel === 'text' ? 'Text' : 'Mail'} ${message.id} to ${message.recipient} not sent ` +
            `(attempt ${attempts}): ${reason}${failed ? '; giving up' : ''}`,
        );
      }
    }
    return sent;
  }
}
