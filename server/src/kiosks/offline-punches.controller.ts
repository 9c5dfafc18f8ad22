import { Controller, Get, HttpCode, Param, Post, Query } from '@nestjs/common';
import { z } from 'zod';
import {
  offlinePunchListSchema,
  type OfflinePunchDto,
  type OfflinePunchListQuery,
  type Page,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { OfflinePunchesService } from './offline-punches.service.js';

const punchIdSchema = z.uuid('Not a punch id');

/**
 * The foreman's list of punches recorded at a kiosk without the server, to confirm or reject. Meant to
 * join the timecard exceptions list.
 */
@Roles('foreman', 'owner')
@Controller('offline-punches')
export class OfflinePunchesController {
  constructor(private readonly offline: OfflinePunchesService) {}

  @Get()
  list(@Query({ schema: offlinePunchListSchema }) query: OfflinePunchListQuery): Page<OfflinePunchDto> {
    return this.offline.list(query);
  }

  @Post(':id/confirm')
  @HttpCode(200)
  confirm(
    @Param('id', { schema: punchIdSchema }) id: string,
    @CurrentUser() actor: Principal,
  ): OfflinePunchDto {
    return this.offline.confirm(id, actor);
  }

  @Post(':id/reject')
  @HttpCode(200)
  reject(
    @Param('id', { schema: punchIdSchema }) id: string,
    @CurrentUser() actor: Principal,
  ): OfflinePunchDto {
    return this.offline.reject(id, actor);
  }
}
