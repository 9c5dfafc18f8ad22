import { Body, Controller, Delete, Get, Param, Post } from '@nestjs/common';
import {
  createIntegrationKeySchema,
  type CreateIntegrationKeyBody,
  type CreatedIntegrationKey,
  type IntegrationKeyDto,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { IntegrationKeysService } from './integration-keys.service.js';

@Roles('owner')
@Controller('integration-keys')
export class IntegrationKeysController {
  constructor(private readonly keys: IntegrationKeysService) {}

  @Get()
  list(): IntegrationKeyDto[] {
    return this.keys.list();
  }

  @Post()
  create(
    @Body({ schema: createIntegrationKeySchema }) body: CreateIntegrationKeyBody,
    @CurrentUser() actor: Principal,
  ): CreatedIntegrationKey {
    return this.keys.create(body, actor);
  }

  @Delete(':id')
  revoke(
    @Param('id', { schema: idParamSchema }) id: number,
    @CurrentUser() actor: Principal,
  ): IntegrationKeyDto {
    return this.keys.revoke(id, actor);
  }
}
