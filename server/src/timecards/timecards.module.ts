import { Module } from '@nestjs/common';
import { TimecardsController } from './timecards.controller.js';
import { TimecardsService } from './timecards.service.js';

@Module({ controllers: [TimecardsController], providers: [TimecardsService] })
export class TimecardsModule {}
