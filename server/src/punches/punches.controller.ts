import { Body, Controller, Get, Post, Res } from '@nestjs/common';
import type { Response } from 'express';
import { createPunchSchema, type CreatePunchBody, type MyDay, type PunchDto } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { MyDayService } from './my-day.service.js';
import { PunchesService } from './punches.service.js';

@Controller()
export class PunchesController {
  constructor(
    private readonly punches: PunchesService,
    private readonly myDay: MyDayService,
  ) {}

  /** 201 for a new punch; 200 with the stored punch when the same id comes again. */
  @Roles('technician', 'foreman', 'owner')
  @Post('punches')
  record(
    @Body({ schema: createPunchSchema }) body: CreatePunchBody,
    @CurrentUser() actor: Principal,
    @Res({ passthrough: true }) response: Response,
  ): PunchDto {
    const { punch, replayed } = this.punches.record(body, actor);
    response.status(replayed ? 200 : 201);
    return punch;
  }

  @Roles('technician')
  @Get('me/day')
  day(@CurrentUser() technician: Principal): MyDay {
    return this.myDay.get(technician);
  }
}
