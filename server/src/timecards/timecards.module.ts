import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { TimecardsController } from './timecards.controller.js';
import { TimecardsService } from './timecards.service.js';

@Module({ imports: [FloorModule], controllers: [TimecardsController], providers: [TimecardsService] })
export class TimecardsModule {}
