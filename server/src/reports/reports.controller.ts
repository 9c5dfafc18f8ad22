import { Controller, Get, Query, type StreamableFile } from '@nestjs/common';
import { reportQuerySchema, type LabourReport, type PayReport, type ReportQuery } from '@baytime/shared';
import { Roles, Scope } from '../common/decorators/auth.decorators.js';
import { ReportsService } from './reports.service.js';

@Controller('reports')
export class ReportsController {
  constructor(private readonly reports: ReportsService) {}

  @Roles('owner', 'foreman')
  @Scope('reports:read')
  @Get('labour')
  labour(@Query({ schema: reportQuerySchema }) query: ReportQuery): Promise<LabourReport | StreamableFile> {
    return this.reports.labourAnswer(query);
  }

  @Roles('owner')
  @Scope('reports:read')
  @Get('pay')
  pay(@Query({ schema: reportQuerySchema }) query: ReportQuery): PayReport | StreamableFile {
    return this.reports.payAnswer(query);
  }
}
