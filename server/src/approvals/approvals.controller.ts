import { Controller, Param, Post } from '@nestjs/common';
import type { ApprovalLinkDto, ApprovalRequested } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { ApprovalsService } from './approvals.service.js';
import { RequestOrigin } from './client-request.js';

/** The office side of approval links: send one, withdraw one. */
@Roles('advisor', 'owner')
@Controller()
export class ApprovalsController {
  constructor(private readonly approvals: ApprovalsService) {}

  @Post('findings/:id/request-approval')
  request(
    @Param('id', { schema: idParamSchema }) id: number,
    @CurrentUser() actor: Principal,
    @RequestOrigin() origin: string,
  ): ApprovalRequested {
    return this.approvals.request(id, actor, origin);
  }

  @Post('approval-links/:id/revoke')
  revoke(
    @Param('id', { schema: idParamSchema }) id: number,
    @CurrentUser() actor: Principal,
  ): ApprovalLinkDto {
    return this.approvals.revoke(id, actor);
  }
}
