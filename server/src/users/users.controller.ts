import { Body, Controller, Get, Param, Patch, Post } from '@nestjs/common';
import {
  createUserSchema,
  updateUserSchema,
  type CreateUserBody,
  type UpdateUserBody,
  type UserDto,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { UsersService } from './users.service.js';

@Controller('users')
export class UsersController {
  constructor(private readonly users: UsersService) {}

  @Roles('owner', 'foreman')
  @Get()
  list(): UserDto[] {
    return this.users.list();
  }

  @Roles('owner')
  @Post()
  create(
    @Body({ schema: createUserSchema }) body: CreateUserBody,
    @CurrentUser() actor: Principal,
  ): Promise<UserDto> {
    return this.users.create(body, actor);
  }

  @Roles('owner')
  @Patch(':id')
  update(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: updateUserSchema }) body: UpdateUserBody,
    @CurrentUser() actor: Principal,
  ): Promise<UserDto> {
    return this.users.update(id, body, actor);
  }
}
