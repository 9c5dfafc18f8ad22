import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { BoardController } from './board.controller.js';
import { BoardGateway } from './board.gateway.js';
import { BoardService } from './board.service.js';

@Module({
  imports: [FloorModule],
  controllers: [BoardController],
  providers: [BoardService, BoardGateway],
  exports: [BoardService],
})
export class BoardModule {}
