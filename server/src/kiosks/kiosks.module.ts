import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { AuthModule } from '../auth/auth.module.js';
import { PunchesModule } from '../punches/punches.module.js';
import { ScreensModule } from '../screens/screens.module.js';
import { KiosksController } from './kiosks.controller.js';
import { OfflineKeyService } from './offline-key.service.js';
import { OfflinePunchesController } from './offline-punches.controller.js';
import { OfflinePunchesService } from './offline-punches.service.js';

@Module({
  imports: [AuditModule, AuthModule, ScreensModule, PunchesModule],
  controllers: [KiosksController, OfflinePunchesController],
  providers: [OfflineKeyService, OfflinePunchesService],
})
export class KiosksModule {}
