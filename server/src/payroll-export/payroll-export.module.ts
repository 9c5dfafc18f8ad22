import { Module } from '@nestjs/common';
import { ReportsModule } from '../reports/reports.module.js';
import { PayrollExportController } from './payroll-export.controller.js';

@Module({ imports: [ReportsModule], controllers: [PayrollExportController] })
export class PayrollExportModule {}
