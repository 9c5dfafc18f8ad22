import { Global, Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ShopModule } from '../shop/shop.module.js';
import { ClosedWeeksService } from './closed-weeks.service.js';
import { ExceptionsService } from './exceptions.service.js';
import { PayRatesService } from './pay-rates.service.js';

/** Pay rates by date, closed pay weeks and the exceptions list: read by reports, timecards, punches, users. */
@Global()
@Module({
  imports: [ShopModule, AuditModule],
  providers: [ClosedWeeksService, PayRatesService, ExceptionsService],
  exports: [ClosedWeeksService, PayRatesService, ExceptionsService],
})
export class PayrollModule {}
