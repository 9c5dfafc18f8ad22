import { Module } from '@nestjs/common';
import { ShopModule } from '../shop/shop.module.js';
import { LabourService } from './labour.service.js';

@Module({ imports: [ShopModule], providers: [LabourService], exports: [LabourService] })
export class LabourModule {}
