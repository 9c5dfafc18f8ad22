import { Body, Controller, Get, HttpCode, Post, Query } from '@nestjs/common';
import {
  exceptionsQuerySchema,
  reviewExceptionSchema,
  type ExceptionList,
  type ExceptionsQuery,
  type ReviewExceptionBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { ReportsService } from './reports.service.js';

/** The shop-wide exceptions list: what the foreman must deal with before a week's pay is trusted. */
@Controller('exceptions')
export class ExceptionsController {
  constructor(private readonly reports: ReportsService) {}

  @Roles('foreman', 'owner')
  @Get()
  list(@Query({ schema: exceptionsQuerySchema }) query: ExceptionsQuery): ExceptionList {
    return this.reports.exceptions(query.week);
  }

  @Roles('foreman', 'owner')
  @Post('reviews')
  @HttpCode(200)
  review(
    @Body({ schema: reviewExceptionSchema }) body: ReviewExceptionBody,
    @CurrentUser() actor: Principal,
  ): ExceptionList {
    return this.reports.reviewException(body, actor);
  }
}
