import { Inject, Injectable, Logger } from '@nestjs/common';
import type twilio from 'twilio';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';
import { TextboxService } from './textbox.service.js';

/** Options for the provider's client; tests pass an HTTP client that never leaves the machine. */
export const TWILIO_CLIENT_OPTIONS = Symbol('TWILIO_CLIENT_OPTIONS');

/**
 * Text messages through Twilio's SDK when `BAYTIME_TWILIO_*` is set; otherwise into the local fake
 * text box, which keeps them for the owner to read, as the local mailbox does for e-mail.
 */
@Injectable()
export class TextSender {
  private readonly logger = new Logger('Texts');
  private deliver: ((to: string, body: string) => Promise<void>) | null = null;

  constructor(
    @Inject(APP_CONFIG) private readonly config: AppConfig,
    @Inject(TWILIO_CLIENT_OPTIONS) private readonly clientOptions: twilio.ClientOpts,
    private readonly textbox: TextboxService,
  ) {}

  start(): void {
    const provider = this.config.twilio;
    if (!provider) {
      this.logger.log('No BAYTIME_TWILIO_ACCOUNT_SID: texts go to the local text box');
      const from = 'Baytime local text box';
      this.deliver = async (to, body) => {
        this.textbox.record(from, to, body);
      };
      return;
    }
    // The SDK (and the HTTP client under it) loads with the first text: start-up does without it.
    let client: Promise<twilio.Twilio> | null = null;
    const connect = async () =>
      (await import('twilio')).default(provider.accountSid, provider.authToken, {
        autoRetry: false,
        timeout: 30_000,
        ...this.clientOptions,
      });
    // A messaging service id (MG…) lets the provider pick the sending number; otherwise it is a number.
    const from = provider.from.startsWith('MG')
      ? { messagingServiceSid: provider.from }
      : { from: provider.from };
    this.deliver = async (to, body) => {
      client ??= connect();
      await (await client).messages.create({ to, body, ...from });
    };
  }

  send(to: string, body: string): Promise<void> {
    if (!this.deliver) throw new Error('The text sender has not started');
    return this.deliver(to, body);
  }
}
