import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { FloorService } from './floor.service.js';
import { LineAccessService } from './line-access.service.js';

@Module({
  imports: [ShopModule],
  providers: [FloorService, LineAccessService],
  exports: [FloorService, LineAccessService],
})
export class FloorModule {}
