import { Body, Controller, Get, HttpCode, Param, Patch, Post, Put } from '@nestjs/common';
import {
  bayOrderSchema,
  createBaySchema,
  finalCheckSchema,
  updateBaySchema,
  type BayDto,
  type BayOrderBody,
  type CreateBayBody,
  type FinalCheckBody,
  type UpdateBayBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { BaysService } from './bays.service.js';

@Controller('bays')
export class BaysController {
  constructor(private readonly bays: BaysService) {}

  @Get()
  list(): BayDto[] {
    return this.bays.list();
  }

  @Roles('owner')
  @Post()
  create(@Body({ schema: createBaySchema }) body: CreateBayBody, @CurrentUser() actor: Principal): BayDto {
    return this.bays.create(body, actor);
  }

  @Roles('owner')
  @Put('order')
  reorder(@Body({ schema: bayOrderSchema }) body: BayOrderBody, @CurrentUser() actor: Principal): BayDto[] {
    return this.bays.reorder(body, actor);
  }

  @Roles('owner', 'foreman', 'advisor')
  @Post(':id/release')
  @HttpCode(200)
  release(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): BayDto {
    return this.bays.release(id, actor);
  }

  @Roles('technician', 'foreman', 'advisor', 'owner')
  @Post(':id/final-check')
  @HttpCode(200)
  finalCheck(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: finalCheckSchema }) body: FinalCheckBody,
    @CurrentUser() actor: Principal,
  ): BayDto {
    return this.bays.finalCheck(id, body, actor);
  }

  @Roles('owner')
  @Patch(':id')
  update(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: updateBaySchema }) body: UpdateBayBody,
    @CurrentUser() actor: Principal,
  ): BayDto {
    return this.bays.update(id, body, actor);
  }
}
