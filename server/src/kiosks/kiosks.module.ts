import { Module } from '@nestjs/common';
import { PunchesModule } from '../punches/punches.module.js';
import { KiosksController } from './kiosks.controller.js';
import { OfflineKeyService } from './offline-key.service.js';
import { OfflinePunchesController } from './offline-punches.controller.js';
import { OfflinePunchesService } from './offline-punches.service.js';

@Module({
  imports: [PunchesModule],
  controllers: [KiosksController, OfflinePunchesController],
  providers: [OfflineKeyService, OfflinePunchesService],
})
export class KiosksModule {}
