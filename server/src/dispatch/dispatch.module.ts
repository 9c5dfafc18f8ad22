import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { LabourModule } from '../labour/labour.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { BoardModule } from '../board/board.module.js';
import { DispatchController } from './dispatch.controller.js';
import { DispatchService } from './dispatch.service.js';

@Module({
  imports: [ShopModule, LabourModule, FloorModule, BoardModule],
  controllers: [DispatchController],
  providers: [DispatchService],
  exports: [DispatchService],
})
export class DispatchModule {}
