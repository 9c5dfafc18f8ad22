import { Module } from '@nestjs/common';
import { EventLoopService } from './event-loop.service.js';
import { HealthController } from './health.controller.js';

@Module({ controllers: [HealthController], providers: [EventLoopService] })
export class HealthModule {}
