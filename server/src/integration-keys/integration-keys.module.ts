import { Module } from '@nestjs/common';
import { APP_INTERCEPTOR } from '@nestjs/core';
import { ThrottlerStorageService } from '@nestjs/throttler';
import { AuditModule } from '../audit/audit.module.js';
import { CallerContextInterceptor } from '../common/caller-context.js';
import { IntegrationKeysController } from './integration-keys.controller.js';
import { IntegrationKeysService, KEY_THROTTLE } from './integration-keys.service.js';

@Module({
  imports: [AuditModule],
  controllers: [IntegrationKeysController],
  providers: [
    IntegrationKeysService,
    { provide: KEY_THROTTLE, useClass: ThrottlerStorageService },
    { provide: APP_INTERCEPTOR, useClass: CallerContextInterceptor },
  ],
  exports: [IntegrationKeysService],
})
export class IntegrationKeysModule {}
