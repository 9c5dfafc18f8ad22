import { Module } from '@nestjs/common';
import { MailService } from './mail.service.js';
import { MailboxController } from './mailbox.controller.js';
import { MailboxService } from './mailbox.service.js';

@Module({
  controllers: [MailboxController],
  providers: [MailService, MailboxService],
  exports: [MailService],
})
export class MailModule {}
