import { Controller, Get } from '@nestjs/common';
import type { BoardSnapshot } from '@baytime/shared';
import { BoardService } from './board.service.js';

@Controller('board')
export class BoardController {
  constructor(private readonly board: BoardService) {}

  @Get()
  get(): BoardSnapshot {
    return this.board.current();
  }
}
