import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ReportsModule } from '../reports/reports.module.js';
import { ShopModule } from '../shop/shop.module.js';
import { WebhooksModule } from '../webhooks/webhooks.module.js';
import { PayWeeksController } from './pay-weeks.controller.js';
import { PayWeeksService } from './pay-weeks.service.js';

@Module({
  imports: [ReportsModule, ShopModule, AuditModule, WebhooksModule],
  controllers: [PayWeeksController],
  providers: [PayWeeksService],
})
export class PayWeeksModule {}
