import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { FindingsModule } from '../findings/findings.module.js';
import { ShopModule } from '../shop/shop.module.js';
import { ApprovalThrottle } from './approval-throttle.js';
import { ApprovalsController } from './approvals.controller.js';
import { ApprovalsService } from './approvals.service.js';
import { PublicApprovalsController } from './public-approvals.controller.js';

@Module({
  imports: [AuditModule, ShopModule, FindingsModule],
  controllers: [ApprovalsController, PublicApprovalsController],
  providers: [ApprovalsService, ApprovalThrottle],
})
export class ApprovalsModule {}
