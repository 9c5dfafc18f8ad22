import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { ScreensModule } from '../screens/screens.module.js';
import { UsersModule } from '../users/users.module.js';
import { DemoShopSeeder } from './demo-shop.js';
import { StartupService } from './startup.service.js';

@Module({
  imports: [ShopModule, ScreensModule, UsersModule],
  providers: [StartupService, DemoShopSeeder],
  exports: [StartupService],
})
export class DemoModule {}
