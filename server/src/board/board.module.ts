import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { AuthModule } from '../auth/auth.module.js';
import { ScreensModule } from '../screens/screens.module.js';
import { FloorModule } from '../floor/floor.module.js';
import { BoardController } from './board.controller.js';
import { BoardGateway } from './board.gateway.js';
import { BoardService } from './board.service.js';

@Module({
  imports: [ShopModule, AuthModule, ScreensModule, FloorModule],
  controllers: [BoardController],
  providers: [BoardService, BoardGateway],
  exports: [BoardService],
})
export class BoardModule {}
