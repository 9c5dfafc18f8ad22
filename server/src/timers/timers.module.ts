import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { TimersController } from './timers.controller.js';
import { TimersService } from './timers.service.js';

@Module({ imports: [FloorModule], controllers: [TimersController], providers: [TimersService] })
export class TimersModule {}
