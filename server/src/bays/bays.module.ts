import { Module } from '@nestjs/common';
import { BaysController } from './bays.controller.js';
import { BaysService } from './bays.service.js';

@Module({ controllers: [BaysController], providers: [BaysService] })
export class BaysModule {}
