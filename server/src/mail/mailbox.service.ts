import { Inject, Injectable, Logger, NotFoundException } from '@nestjs/common';
import { randomUUID } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { join } from 'node:path';
import type { SMTPServer, SMTPServerAddress, SMTPServerSession } from 'smtp-server';
import type { MailboxEntry, MailboxMessage, Page, PageQuery } from '@baytime/shared';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { JsonIndex } from './json-index.js';
import { parseMail } from './mime.js';

const MAX_MESSAGE_BYTES = 80 * 1024 * 1024;

/**
 * The local stand-in for a mail server, used when no SMTP server is configured: it listens on
 * loopback only, accepts every message over real SMTP and keeps it as a raw .eml file under
 * `dataDir/mailbox/`, with an index of the headers beside it, so the owner can read what was sent.
 */
@Injectable()
export class MailboxService {
  private readonly logger = new Logger('Mailbox');
  private readonly dir: string;
  private readonly index: JsonIndex<MailboxEntry>;
  private server: SMTPServer | null = null;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.dir = join(config.dataDir, 'mailbox');
    this.index = new JsonIndex(join(this.dir, 'index.json'));
  }

  /** Starts the fake SMTP server on a free loopback port and answers that port. */
  async start(): Promise<number> {
    mkdirSync(this.dir, { recursive: true });
    const { SMTPServer } = await import('smtp-server');
    const server = new SMTPServer({
      authOptional: true,
      disabledCommands: ['STARTTLS'],
      disableReverseLookup: true,
      logger: false,
      size: MAX_MESSAGE_BYTES,
      closeTimeout: 2000,
      banner: 'Baytime local mailbox',
      onData: (stream, session, callback) => {
        const chunks: Buffer[] = [];
        stream.on('data', (chunk: Buffer) => chunks.push(chunk));
        stream.on('error', (error) => callback(error));
        stream.on('end', () => {
          if (stream.sizeExceeded) return callback(new Error('The message is too large'));
          try {
            this.store(Buffer.concat(chunks), session);
            callback();
          } catch (error) {
            callback(error as Error);
          }
        });
      },
    });
    server.on('error', (error) => this.logger.warn(`Local mailbox: ${error.message}`));
    await new Promise<void>((resolve, reject) => {
      server.server.once('error', reject);
      server.listen(0, '127.0.0.1', () => {
        server.server.off('error', reject);
        resolve();
      });
    });
    this.server = server;
    const { port } = server.server.address() as AddressInfo;
    this.logger.log(`No BAYTIME_SMTP_URL: e-mail goes to the local mailbox (127.0.0.1:${port})`);
    return port;
  }

  async stop(): Promise<void> {
    const server = this.server;
    this.server = null;
    if (server) await new Promise<void>((resolve) => server.close(() => resolve()));
  }

  list(query: PageQuery): Page<MailboxEntry> {
    return this.index.page(query);
  }

  get(id: string): MailboxMessage {
    const entry = this.index.find(id);
    const file = join(this.dir, `${id}.eml`);
    if (!entry || !existsSync(file)) throw new NotFoundException('Message not found');
    return { ...entry, text: parseMail(readFileSync(file)).text };
  }

  private store(raw: Buffer, session: SMTPServerSession): void {
    const parsed = parseMail(raw);
    const id = randomUUID();
    writeFileSync(join(this.dir, `${id}.eml`), raw);
    const envelopeFrom = session.envelope.mailFrom;
    const entry: MailboxEntry = {
      id,
      from: parsed.from || (envelopeFrom ? envelopeFrom.address : ''),
      to: session.envelope.rcptTo.map((rcpt: SMTPServerAddress) => rcpt.address),
      subject: parsed.subject,
      date: new Date().toISOString(),
      attachments: parsed.attachments.map((a) => a.filename),
      sizeBytes: raw.length,
    };
    this.index.append(entry);
  }
}
