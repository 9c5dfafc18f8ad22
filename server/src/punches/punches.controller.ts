import { Body, Controller, Get, HttpCode, Param, Post, Res } from '@nestjs/common';
import type { Response } from 'express';
import { z } from 'zod';
import {
  createPunchSchema,
  resolutionSchema,
  type CreatePunchBody,
  type HeldPunchDto,
  type MyDay,
  type PunchDto,
  type ResolutionBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { MyDayService } from './my-day.service.js';
import { PunchesService } from './punches.service.js';

const punchIdSchema = z.uuid();

@Controller()
export class PunchesController {
  constructor(
    private readonly punches: PunchesService,
    private readonly myDay: MyDayService,
  ) {}

  /** 201 for a new punch; 202 when a late one is held for review; 200 with the stored punch for the same id. */
  @Roles('technician', 'foreman', 'owner')
  @Post('punches')
  record(
    @Body({ schema: createPunchSchema }) body: CreatePunchBody,
    @CurrentUser() actor: Principal,
    @Res({ passthrough: true }) response: Response,
  ): PunchDto | HeldPunchDto {
    const { punch, replayed, held } = this.punches.record(body, actor);
    response.status(replayed ? 200 : held ? 202 : 201);
    return punch;
  }

  @Roles('foreman', 'owner')
  @Post('punches/held/:id/accept')
  @HttpCode(200)
  accept(
    @Param('id', { schema: punchIdSchema }) id: string,
    @Body({ schema: resolutionSchema }) body: ResolutionBody,
    @CurrentUser() actor: Principal,
  ): HeldPunchDto {
    return this.punches.acceptHeld(id, body, actor);
  }

  @Roles('foreman', 'owner')
  @Post('punches/held/:id/reject')
  @HttpCode(200)
  reject(
    @Param('id', { schema: punchIdSchema }) id: string,
    @Body({ schema: resolutionSchema }) body: ResolutionBody,
    @CurrentUser() actor: Principal,
  ): HeldPunchDto {
    return this.punches.rejectHeld(id, body, actor);
  }

  @Roles('technician')
  @Get('me/day')
  day(@CurrentUser() technician: Principal): MyDay {
    return this.myDay.get(technician);
  }
}
