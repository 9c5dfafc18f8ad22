import { Module } from '@nestjs/common';
import { WorkModule } from '../work/work.module.js';
import { RepairOrderImportController } from './repair-order-import.controller.js';
import { RepairOrderImportService } from './repair-order-import.service.js';

@Module({
  imports: [WorkModule],
  controllers: [RepairOrderImportController],
  providers: [RepairOrderImportService],
})
export class RepairOrderImportModule {}
