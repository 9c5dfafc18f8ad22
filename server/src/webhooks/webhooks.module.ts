import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { WebhookDeliverer } from './webhook-deliverer.service.js';
import { WebhookOutbox } from './webhook-outbox.service.js';
import { WebhooksController } from './webhooks.controller.js';
import { WebhooksService } from './webhooks.service.js';

@Module({
  imports: [AuditModule],
  controllers: [WebhooksController],
  providers: [WebhooksService, WebhookOutbox, WebhookDeliverer],
  exports: [WebhookOutbox],
})
export class WebhooksModule {}
