import { Module } from '@nestjs/common';
import { ReportsModule } from '../reports/reports.module.js';
import { PayWeeksController } from './pay-weeks.controller.js';
import { PayWeeksService } from './pay-weeks.service.js';

@Module({ imports: [ReportsModule], controllers: [PayWeeksController], providers: [PayWeeksService] })
export class PayWeeksModule {}
