import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { MailService } from './mail.service.js';
import { MailboxController } from './mailbox.controller.js';
import { MailboxService } from './mailbox.service.js';

@Module({
  imports: [ShopModule],
  controllers: [MailboxController],
  providers: [MailService, MailboxService],
  exports: [MailService],
})
export class MailModule {}
