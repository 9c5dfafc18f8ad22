import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { MailModule } from '../mail/mail.module.js';
import { WorkModule } from '../work/work.module.js';
import { AttachmentsController } from './attachments.controller.js';
import { FindingsController } from './findings.controller.js';
import { FindingsService } from './findings.service.js';
import { NoticesService } from './notices.service.js';
import { PhotoStore } from './photo-store.js';
import { ReadyNoticeController } from './ready-notice.controller.js';

@Module({
  imports: [FloorModule, WorkModule, MailModule],
  controllers: [FindingsController, AttachmentsController, ReadyNoticeController],
  providers: [FindingsService, NoticesService, PhotoStore],
  exports: [FindingsService, NoticesService, PhotoStore],
})
export class FindingsModule {}
