import { Module } from '@nestjs/common';
import { MyDayService } from './my-day.service.js';
import { PunchesController } from './punches.controller.js';
import { PunchesService } from './punches.service.js';

@Module({
  controllers: [PunchesController],
  providers: [PunchesService, MyDayService],
  exports: [PunchesService],
})
export class PunchesModule {}
