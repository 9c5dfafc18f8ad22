import { Controller, Get, Query } from '@nestjs/common';
import { z } from 'zod';
import { REPAIR_ORDER_STATUSES, type RepairOrderStatus } from '@baytime/shared';
import { Roles } from '../common/decorators/auth.decorators.js';
import { RepairOrdersService, type RepairOrderSummary } from './repair-orders.service.js';

@Roles('owner', 'foreman', 'advisor')
@Controller('repair-orders')
export class RepairOrdersController {
  constructor(private readonly repairOrders: RepairOrdersService) {}

  @Get()
  list(
    @Query('status', { schema: z.enum(REPAIR_ORDER_STATUSES).optional() }) status?: RepairOrderStatus,
  ): RepairOrderSummary[] {
    return this.repairOrders.list(status);
  }
}
