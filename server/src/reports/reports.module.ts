import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { ExceptionsController } from './exceptions.controller.js';
import { PaySummaryService } from './pay-summary.service.js';
import { ReportsController } from './reports.controller.js';
import { ReportsService } from './reports.service.js';
import { WeekFiguresService } from './week-figures.service.js';

@Module({
  imports: [ShopModule],
  controllers: [ReportsController, ExceptionsController],
  providers: [ReportsService, PaySummaryService, WeekFiguresService],
  exports: [ReportsService, PaySummaryService],
})
export class ReportsModule {}
