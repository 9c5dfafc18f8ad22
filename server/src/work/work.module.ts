import { Module } from '@nestjs/common';
import { DispatchModule } from '../dispatch/dispatch.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { PunchesModule } from '../punches/punches.module.js';
import { JobLinesController } from './job-lines.controller.js';
import { JobLinesService } from './job-lines.service.js';
import { OperationsController } from './operations.controller.js';
import { OperationsService } from './operations.service.js';
import { PartsController } from './parts.controller.js';
import { PartsService } from './parts.service.js';
import { RepairOrdersController } from './repair-orders.controller.js';
import { RepairOrdersService } from './repair-orders.service.js';

@Module({
  imports: [FloorModule, PunchesModule, DispatchModule],
  controllers: [RepairOrdersController, JobLinesController, OperationsController, PartsController],
  providers: [RepairOrdersService, JobLinesService, OperationsService, PartsService],
  exports: [JobLinesService],
})
export class WorkModule {}
