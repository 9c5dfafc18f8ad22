import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { PunchesModule } from '../punches/punches.module.js';
import { ReportsModule } from '../reports/reports.module.js';
import { TimecardsController } from './timecards.controller.js';
import { TimecardsService } from './timecards.service.js';

@Module({
  imports: [FloorModule, PunchesModule, ReportsModule],
  controllers: [TimecardsController],
  providers: [TimecardsService],
})
export class TimecardsModule {}
