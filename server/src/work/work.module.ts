import { Module } from '@nestjs/common';
import { PunchesModule } from '../punches/punches.module.js';
import { JobLinesController } from './job-lines.controller.js';
import { JobLinesService } from './job-lines.service.js';
import { RepairOrdersController } from './repair-orders.controller.js';
import { RepairOrdersService } from './repair-orders.service.js';

@Module({
  imports: [PunchesModule],
  controllers: [RepairOrdersController, JobLinesController],
  providers: [RepairOrdersService, JobLinesService],
  exports: [JobLinesService],
})
export class WorkModule {}
