import { ConflictException, Controller, Get, Param, type StreamableFile } from '@nestjs/common';
import { isoWeekSchema } from '@baytime/shared';
import { Roles, Scope } from '../common/decorators/auth.decorators.js';
import { ReportsService } from '../reports/reports.service.js';
import { payrollCsv } from './payroll-csv.js';

@Controller('pay-weeks')
export class PayrollExportController {
  constructor(private readonly reports: ReportsService) {}

  /** The closed week's payroll CSV, from the pay report it was closed with. */
  @Roles('owner')
  @Scope('reports:read')
  @Get(':week/payroll.csv')
  payroll(@Param('week', { schema: isoWeekSchema }) week: string): StreamableFile {
    const report = this.reports.pay(week);
    // What a payroll provider imports is paid: only figures that can no longer change go to it.
    if (!report.closed)
      throw new ConflictException(
        `The ${report.weekName.replace(/^Week/, 'week')} is not closed for pay: close it first, so payroll gets its final figures`,
      );
    return payrollCsv(report);
  }
}
