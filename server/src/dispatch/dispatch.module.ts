import { Module } from '@nestjs/common';
import { FloorModule } from '../floor/floor.module.js';
import { BoardModule } from '../board/board.module.js';
import { DispatchController } from './dispatch.controller.js';
import { DispatchService } from './dispatch.service.js';

@Module({
  imports: [FloorModule, BoardModule],
  controllers: [DispatchController],
  providers: [DispatchService],
  exports: [DispatchService],
})
export class DispatchModule {}
