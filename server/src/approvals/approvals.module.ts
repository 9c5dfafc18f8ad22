import { Module } from '@nestjs/common';
import { FindingsModule } from '../findings/findings.module.js';
import { ApprovalThrottle } from './approval-throttle.js';
import { ApprovalsController } from './approvals.controller.js';
import { ApprovalsService } from './approvals.service.js';
import { PublicApprovalsController } from './public-approvals.controller.js';

@Module({
  imports: [FindingsModule],
  controllers: [ApprovalsController, PublicApprovalsController],
  providers: [ApprovalsService, ApprovalThrottle],
})
export class ApprovalsModule {}
