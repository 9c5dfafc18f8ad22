import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { AuditModule } from '../audit/audit.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { UsersController } from './users.controller.js';
import { UsersService } from './users.service.js';

@Module({
  imports: [ShopModule, AuditModule, FloorModule],
  controllers: [UsersController],
  providers: [UsersService],
  exports: [UsersService],
})
export class UsersModule {}
