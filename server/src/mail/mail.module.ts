import { Module } from '@nestjs/common';
import { MailSender } from './mail-sender.js';
import { MailboxController } from './mailbox.controller.js';
import { MailboxService } from './mailbox.service.js';
import { OutboxService } from './outbox.service.js';
import { TextSender, TWILIO_CLIENT_OPTIONS } from './text-sender.js';
import { TextboxController } from './textbox.controller.js';
import { TextboxService } from './textbox.service.js';

/** Outgoing e-mail and text messages, through one outbox, and the local fakes that stand in for them. */
@Module({
  controllers: [MailboxController, TextboxController],
  providers: [
    OutboxService,
    MailSender,
    MailboxService,
    TextSender,
    TextboxService,
    { provide: TWILIO_CLIENT_OPTIONS, useValue: {} },
  ],
  exports: [OutboxService],
})
export class MailModule {}
