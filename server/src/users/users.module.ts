import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { UsersController } from './users.controller.js';
import { UsersService } from './users.service.js';

@Module({
  imports: [AuditModule, FloorModule],
  controllers: [UsersController],
  providers: [UsersService],
  exports: [UsersService],
})
export class UsersModule {}
