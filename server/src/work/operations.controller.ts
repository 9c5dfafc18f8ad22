import { Body, Controller, Get, Param, Patch, Post } from '@nestjs/common';
import {
  operationInputSchema,
  updateOperationSchema,
  type OperationDto,
  type OperationInput,
  type UpdateOperationBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { OperationsService } from './operations.service.js';

@Controller('operations')
export class OperationsController {
  constructor(private readonly operations: OperationsService) {}

  @Roles('owner', 'foreman', 'advisor')
  @Get()
  list(): OperationDto[] {
    return this.operations.list();
  }

  @Roles('owner')
  @Post()
  create(
    @Body({ schema: operationInputSchema }) body: OperationInput,
    @CurrentUser() actor: Principal,
  ): OperationDto {
    return this.operations.create(body, actor);
  }

  @Roles('owner')
  @Patch(':id')
  update(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: updateOperationSchema }) body: UpdateOperationBody,
    @CurrentUser() actor: Principal,
  ): OperationDto {
    return this.operations.update(id, body, actor);
  }
}
