import { Module } from '@nestjs/common';
import { FloorService } from './floor.service.js';
import { LineAccessService } from './line-access.service.js';

@Module({ providers: [FloorService, LineAccessService], exports: [FloorService, LineAccessService] })
export class FloorModule {}
