import { Module } from '@nestjs/common';
import { AuditModule } from '../audit/audit.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { BaysController } from './bays.controller.js';
import { BaysService } from './bays.service.js';

@Module({ imports: [AuditModule, FloorModule], controllers: [BaysController], providers: [BaysService] })
export class BaysModule {}
