import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { TimersController } from './timers.controller.js';
import { TimersService } from './timers.service.js';

@Module({ imports: [AuditModule, FloorModule], controllers: [TimersController], providers: [TimersService] })
export class TimersModule {}
