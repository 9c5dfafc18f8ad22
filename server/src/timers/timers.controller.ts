import { Body, Controller, Delete, Get, HttpCode, Param, Post } from '@nestjs/common';
import {
  holdPresetSchema,
  startTimerSchema,
  timerReadingSchema,
  type HoldPresetBody,
  type HoldPresetDto,
  type StartTimerBody,
  type TimerDto,
  type TimerReadingBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { TimersService } from './timers.service.js';

@Controller()
export class TimersController {
  constructor(private readonly timers: TimersService) {}

  /**
   * A kiosk tablet reads them on its own token, so it still chimes for the technicians who signed in
   * on it after their sign-ins ran out; it can start, read into or stop none of them.
   */
  @Roles('technician', 'foreman', 'owner', 'kiosk')
  @Get('timers')
  running(): TimerDto[] {
    return this.timers.running();
  }

  @Roles('technician', 'foreman')
  @Post('timers')
  start(@Body({ schema: startTimerSchema }) body: StartTimerBody, @CurrentUser() actor: Principal): TimerDto {
    return this.timers.start(body, actor);
  }

  @Roles('technician', 'foreman')
  @Post('timers/:id/readings')
  @HttpCode(200)
  reading(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: timerReadingSchema }) body: TimerReadingBody,
    @CurrentUser() actor: Principal,
  ): TimerDto {
    return this.timers.addReading(id, body, actor);
  }

  @Roles('technician', 'foreman', 'owner')
  @Post('timers/:id/stop')
  @HttpCode(200)
  stop(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): TimerDto {
    return this.timers.stop(id, actor);
  }

  @Get('hold-presets')
  presets(): HoldPresetDto[] {
    return this.timers.presets();
  }

  @Roles('owner')
  @Post('hold-presets')
  addPreset(
    @Body({ schema: holdPresetSchema }) body: HoldPresetBody,
    @CurrentUser() actor: Principal,
  ): HoldPresetDto {
    return this.timers.addPreset(body, actor);
  }

  @Roles('owner')
  @Delete('hold-presets/:id')
  removePreset(
    @Param('id', { schema: idParamSchema }) id: number,
    @CurrentUser() actor: Principal,
  ): HoldPresetDto {
    return this.timers.removePreset(id, actor);
  }
}
