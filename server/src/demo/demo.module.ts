import { Module } from '@nestjs/common';
import { UsersModule } from '../users/users.module.js';
import { DemoShopSeeder } from './demo-shop.js';
import { StartupService } from './startup.service.js';

@Module({ imports: [UsersModule], providers: [StartupService, DemoShopSeeder], exports: [StartupService] })
export class DemoModule {}
