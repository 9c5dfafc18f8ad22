import { Module } from '@nestjs/common';
import { RepairOrdersController } from './repair-orders.controller.js';
import { RepairOrdersService } from './repair-orders.service.js';

@Module({ controllers: [RepairOrdersController], providers: [RepairOrdersService] })
export class WorkModule {}
