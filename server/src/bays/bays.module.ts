import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { BaysController } from './bays.controller.js';
import { BaysService } from './bays.service.js';

@Module({ imports: [FloorModule], controllers: [BaysController], providers: [BaysService] })
export class BaysModule {}
