import { Body, Controller, Get, Post, Query } from '@nestjs/common';
import {
  correctionSchema,
  timecardQuerySchema,
  type CorrectionBody,
  type PunchDto,
  type Timecard,
  type TimecardQuery,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles, Scope } from '../common/decorators/auth.decorators.js';
import { TimecardsService } from './timecards.service.js';

@Controller('timecards')
export class TimecardsController {
  constructor(private readonly timecards: TimecardsService) {}

  @Roles('technician', 'foreman', 'owner')
  @Scope('punches:read')
  @Get()
  get(
    @Query({ schema: timecardQuerySchema }) query: TimecardQuery,
    @CurrentUser() actor: Principal,
  ): Timecard {
    return this.timecards.get(query, actor);
  }

  @Roles('foreman', 'owner')
  @Post('corrections')
  correct(
    @Body({ schema: correctionSchema }) body: CorrectionBody,
    @CurrentUser() actor: Principal,
  ): PunchDto {
    return this.timecards.correct(body, actor);
  }
}
