import { Module } from '@nestjs/common';
import { BoardModule } from '../board/board.module.js';
import { DispatchController } from './dispatch.controller.js';
import { DispatchService } from './dispatch.service.js';

@Module({ imports: [BoardModule], controllers: [DispatchController], providers: [DispatchService] })
export class DispatchModule {}
