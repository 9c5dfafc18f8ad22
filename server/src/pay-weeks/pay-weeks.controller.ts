import { Body, Controller, HttpCode, Param, Post } from '@nestjs/common';
import { isoWeekSchema, reopenWeekSchema, type PayWeekState, type ReopenWeekBody } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { PayWeeksService } from './pay-weeks.service.js';

/** `:week` is `YYYY-Www`: the shop workweek that starts in that ISO week. */
@Controller('pay-weeks')
export class PayWeeksController {
  constructor(private readonly payWeeks: PayWeeksService) {}

  @Roles('owner')
  @Post(':week/close')
  @HttpCode(200)
  close(
    @Param('week', { schema: isoWeekSchema }) week: string,
    @CurrentUser() actor: Principal,
  ): PayWeekState {
    return this.payWeeks.close(week, actor);
  }

  @Roles('owner')
  @Post(':week/reopen')
  @HttpCode(200)
  reopen(
    @Param('week', { schema: isoWeekSchema }) week: string,
    @Body({ schema: reopenWeekSchema }) body: ReopenWeekBody,
    @CurrentUser() actor: Principal,
  ): PayWeekState {
    return this.payWeeks.reopen(week, body, actor);
  }
}
