import { Body, Controller, Delete, Get, Param, Post } from '@nestjs/common';
import { createScreenSchema, type CreateScreenBody, type ScreenPairing } from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { ScreensService, type ScreenDto } from './screens.service.js';

@Roles('owner', 'foreman')
@Controller('screens')
export class ScreensController {
  constructor(private readonly screens: ScreensService) {}

  @Get()
  list(): ScreenDto[] {
    return this.screens.list();
  }

  @Post()
  create(
    @Body({ schema: createScreenSchema }) body: CreateScreenBody,
    @CurrentUser() actor: Principal,
  ): ScreenPairing {
    return this.screens.create(body, actor);
  }

  @Delete(':id')
  revoke(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): ScreenDto {
    return this.screens.revoke(id, actor);
  }
}
