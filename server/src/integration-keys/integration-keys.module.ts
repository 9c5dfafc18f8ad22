import { Module } from '@nestjs/common';
import { ThrottlerStorageService } from '@nestjs/throttler';
import { AuditModule } from '../audit/audit.module.js';
import { IntegrationKeysController } from './integration-keys.controller.js';
import { IntegrationKeysService, KEY_THROTTLE } from './integration-keys.service.js';

@Module({
  imports: [AuditModule],
  controllers: [IntegrationKeysController],
  providers: [IntegrationKeysService, { provide: KEY_THROTTLE, useClass: ThrottlerStorageService }],
  exports: [IntegrationKeysService],
})
export class IntegrationKeysModule {}
