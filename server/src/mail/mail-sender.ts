import { Inject, Injectable } from '@nestjs/common';
import { and, asc, eq } from 'drizzle-orm';
import type { Transporter } from 'nodemailer';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { DB, type Db } from '../db/database.js';
import { mailOutbox, users } from '../db/schema/index.js';
import { ShopService } from '../shop/shop.service.js';
import { MailboxService } from './mailbox.service.js';

/** E-mail over SMTP: the configured server, or the local fake mailbox when none is set. */
@Injectable()
export class MailSender {
  private transport: Transporter | null = null;

  constructor(
    @Inject(DB) private readonly db: Db,
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    private readonly shop: ShopService,
    private readonly mailbox: MailboxService,
  ) {}

  async start(): Promise<void> {
    const server = this.config.smtpUrl
      ? { url: this.config.smtpUrl }
      : { host: '127.0.0.1', port: await this.mailbox.start(), secure: false, ignoreTLS: true };
    const { createTransport } = await import('nodemailer');
    this.transport = createTransport({
      ...server,
      connectionTimeout: 10_000,
      greetingTimeout: 10_000,
      socketTimeout: 30_000,
    });
  }

  async stop(): Promise<void> {
    this.transport?.close();
    await this.mailbox.stop();
  }

  async send(mail: typeof mailOutbox.$inferSelect): Promise<void> {
    if (!this.transport) throw new Error('The mail sender has not started');
    await this.transport.sendMail({
      from: this.sender(),
      to: mail.recipient,
      subject: mail.subject ?? '',
      text: mail.text,
      attachments: mail.attachments ?? [],
    });
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
