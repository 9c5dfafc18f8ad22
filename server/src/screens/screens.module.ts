import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { ScreensController } from './screens.controller.js';
import { ScreensService } from './screens.service.js';

@Module({
  imports: [AuditModule],
  controllers: [ScreensController],
  providers: [ScreensService],
  exports: [ScreensService],
})
export class ScreensModule {}
