import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ShopModule } from '../shop/shop.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { TimecardsController } from './timecards.controller.js';
import { TimecardsService } from './timecards.service.js';

@Module({
  imports: [AuditModule, ShopModule, FloorModule],
  controllers: [TimecardsController],
  providers: [TimecardsService],
})
export class TimecardsModule {}
