import { Body, Controller, Get, Param, Post, Query, Res } from '@nestjs/common';
import type { Response } from 'express';
import {
  createRepairOrderSchema,
  repairOrderListQuerySchema,
  type CreateRepairOrderBody,
  type RepairOrderListQuery,
  type RepairOrderPage,
  type RepairOrderSummary,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles, Scope } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { RepairOrdersService } from './repair-orders.service.js';

@Roles('owner', 'foreman', 'advisor')
@Controller('repair-orders')
export class RepairOrdersController {
  constructor(private readonly repairOrders: RepairOrdersService) {}

  @Scope('repair-orders:read')
  @Get()
  list(@Query({ schema: repairOrderListQuerySchema }) query: RepairOrderListQuery): RepairOrderPage {
    return this.repairOrders.list(query);
  }

  @Scope('repair-orders:read')
  @Get(':id')
  get(@Param('id', { schema: idParamSchema }) id: number): RepairOrderSummary {
    return this.repairOrders.get(id);
  }

  /** 201 for a new RO; 200 with the RO already written when its `externalRef` comes again. */
  @Scope('repair-orders:write')
  @Post()
  create(
    @Body({ schema: createRepairOrderSchema }) body: CreateRepairOrderBody,
    @CurrentUser() actor: Principal,
    @Res({ passthrough: true }) response: Response,
  ): RepairOrderSummary {
    const { repairOrder, replayed } = this.repairOrders.createOnce(body, actor);
    response.status(replayed ? 200 : 201);
    return repairOrder;
  }
}
