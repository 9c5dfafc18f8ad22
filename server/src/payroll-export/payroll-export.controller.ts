import { Controller, Get, Param, type StreamableFile } from '@nestjs/common';
import { isoWeekSchema } from '@baytime/shared';
import { Roles, Scope } from '../common/decorators/auth.decorators.js';
import { ReportsService } from '../reports/reports.service.js';
import { payrollCsv } from './payroll-csv.js';

@Controller('pay-weeks')
export class PayrollExportController {
  constructor(private readonly reports: ReportsService) {}

  /** The week's payroll CSV, from the pay report of that week. */
  @Roles('owner')
  @Scope('reports:read')
  @Get(':week/payroll.csv')
  payroll(@Param('week', { schema: isoWeekSchema }) week: string): StreamableFile {
    return payrollCsv(this.reports.pay(week));
  }
}
