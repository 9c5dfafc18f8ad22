import { Body, Controller, HttpCode, Param, Post, Put } from '@nestjs/common';
import {
  partsDetailsSchema,
  type JobLineDto,
  type PartsDetailsBody,
  type PartsHoldDto,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { PartsService } from './parts.service.js';

@Roles('advisor', 'foreman', 'owner')
@Controller('job-lines')
export class PartsController {
  constructor(private readonly parts: PartsService) {}

  @Put(':id/parts')
  record(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: partsDetailsSchema }) body: PartsDetailsBody,
    @CurrentUser() actor: Principal,
  ): PartsHoldDto {
    return this.parts.record(id, body, actor);
  }

  @Post(':id/parts/received')
  @HttpCode(200)
  received(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): JobLineDto {
    return this.parts.received(id, actor);
  }
}
