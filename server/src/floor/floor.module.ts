import { Module } from '@nestjs/common';
import { FloorService } from './floor.service.js';

@Module({ providers: [FloorService], exports: [FloorService] })
export class FloorModule {}
