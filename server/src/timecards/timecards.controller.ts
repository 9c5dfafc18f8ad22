import { Body, Controller, Get, Post, Query, Res } from '@nestjs/common';
import type { Response } from 'express';
import {
  correctionQuerySchema,
  correctionSchema,
  timecardQuerySchema,
  voidPunchSchema,
  type CorrectionBody,
  type CorrectionPreview,
  type CorrectionQuery,
  type PunchDto,
  type Timecard,
  type TimecardQuery,
  type VoidPunchBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles, Scope } from '../common/decorators/auth.decorators.js';
import { CorrectionsService } from './corrections.service.js';
import { TimecardsService } from './timecards.service.js';

@Controller('timecards')
export class TimecardsController {
  constructor(
    private readonly timecards: TimecardsService,
    private readonly corrections: CorrectionsService,
  ) {}

  @Roles('technician', 'foreman', 'owner')
  @Scope('punches:read')
  @Get()
  get(
    @Query({ schema: timecardQuerySchema }) query: TimecardQuery,
    @CurrentUser() actor: Principal,
  ): Timecard {
    return this.timecards.get(query, actor);
  }

  /** `?preview=true` answers 200 with what the correction would do and saves nothing. */
  @Roles('foreman', 'owner')
  @Post('corrections')
  correct(
    @Query({ schema: correctionQuerySchema }) query: CorrectionQuery,
    @Body({ schema: correctionSchema }) body: CorrectionBody,
    @CurrentUser() actor: Principal,
    @Res({ passthrough: true }) response: Response,
  ): PunchDto | CorrectionPreview {
    if (query.preview !== 'true') return this.corrections.correct(body, actor);
    response.status(200);
    return this.corrections.preview(body);
  }

  /** Takes a wrong punch out of the count; `?preview=true` answers 200 with what it would do. */
  @Roles('foreman', 'owner')
  @Post('voids')
  void(
    @Query({ schema: correctionQuerySchema }) query: CorrectionQuery,
    @Body({ schema: voidPunchSchema }) body: VoidPunchBody,
    @CurrentUser() actor: Principal,
    @Res({ passthrough: true }) response: Response,
  ): PunchDto | CorrectionPreview {
    if (query.preview !== 'true') return this.corrections.void(body, actor);
    response.status(200);
    return this.corrections.previewVoid(body);
  }
}
