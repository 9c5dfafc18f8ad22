import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ShopModule } from '../shop/shop.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { PunchesModule } from '../punches/punches.module.js';
import { ReportsModule } from '../reports/reports.module.js';
import { TimecardsController } from './timecards.controller.js';
import { CorrectionsService } from './corrections.service.js';
import { TimecardsService } from './timecards.service.js';

@Module({
  imports: [AuditModule, ShopModule, FloorModule, PunchesModule, ReportsModule],
  controllers: [TimecardsController],
  providers: [TimecardsService, CorrectionsService],
})
export class TimecardsModule {}
