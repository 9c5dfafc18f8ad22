import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ShopModule } from '../shop/shop.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { MyDayService } from './my-day.service.js';
import { PunchLedgerService } from './punch-ledger.service.js';
import { PunchesController } from './punches.controller.js';
import { PunchesService } from './punches.service.js';

@Module({
  imports: [AuditModule, ShopModule, FloorModule],
  controllers: [PunchesController],
  providers: [PunchesService, MyDayService, PunchLedgerService],
  exports: [PunchesService, PunchLedgerService],
})
export class PunchesModule {}
