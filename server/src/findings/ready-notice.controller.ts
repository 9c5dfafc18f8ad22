import { Controller, HttpCode, Param, Post } from '@nestjs/common';
import type { NoticesQueued } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { NoticesService } from './notices.service.js';

@Controller('repair-orders')
export class ReadyNoticeController {
  constructor(private readonly notices: NoticesService) {}

  @Roles('advisor', 'foreman', 'owner')
  @Post(':id/ready-notice')
  @HttpCode(202)
  send(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): NoticesQueued {
    return this.notices.readyNotice(id, actor);
  }
}
