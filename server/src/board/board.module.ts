import { Module } from '@nestjs/common';
import { BoardController } from './board.controller.js';
import { BoardGateway } from './board.gateway.js';
import { BoardService } from './board.service.js';

@Module({ controllers: [BoardController], providers: [BoardService, BoardGateway], exports: [BoardService] })
export class BoardModule {}
