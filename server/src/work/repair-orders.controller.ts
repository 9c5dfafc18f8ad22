import { Body, Controller, Get, Param, Post, Query } from '@nestjs/common';
import {
  createRepairOrderSchema,
  repairOrderListQuerySchema,
  type CreateRepairOrderBody,
  type RepairOrderListQuery,
  type RepairOrderPage,
  type RepairOrderSummary,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { RepairOrdersService } from './repair-orders.service.js';

@Roles('owner', 'foreman', 'advisor')
@Controller('repair-orders')
export class RepairOrdersController {
  constructor(private readonly repairOrders: RepairOrdersService) {}

  @Get()
  list(@Query({ schema: repairOrderListQuerySchema }) query: RepairOrderListQuery): RepairOrderPage {
    return this.repairOrders.list(query);
  }

  @Get(':id')
  get(@Param('id', { schema: idParamSchema }) id: number): RepairOrderSummary {
    return this.repairOrders.get(id);
  }

  @Post()
  create(
    @Body({ schema: createRepairOrderSchema }) body: CreateRepairOrderBody,
    @CurrentUser() actor: Principal,
  ): RepairOrderSummary {
    return this.repairOrders.create(body, actor);
  }
}
