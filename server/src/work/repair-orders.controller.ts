import { Body, Controller, Get, HttpCode, Param, Patch, Post, Put, Query, Res } from '@nestjs/common';
import type { Response } from 'express';
import {
  addJobLineSchema,
  createRepairOrderSchema,
  editRepairOrderSchema,
  lineOrderSchema,
  repairOrderListQuerySchema,
  type AddJobLineBody,
  type CreateRepairOrderBody,
  type EditRepairOrderBody,
  type JobLineDto,
  type LineOrderBody,
  type RepairOrderHistoryEntry,
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

  @Get(':id/history')
  history(@Param('id', { schema: idParamSchema }) id: number): RepairOrderHistoryEntry[] {
    return this.repairOrders.history(id);
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

  @Patch(':id')
  edit(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: editRepairOrderSchema }) body: EditRepairOrderBody,
    @CurrentUser() actor: Principal,
  ): RepairOrderSummary {
    return this.repairOrders.edit(id, body, actor);
  }

  @Post(':id/lines')
  addLine(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: addJobLineSchema }) body: AddJobLineBody,
    @CurrentUser() actor: Principal,
  ): JobLineDto {
    return this.repairOrders.addLine(id, body, actor);
  }

  @Put(':id/line-order')
  reorderLines(
    @Param('id', { schema: idParamSchema }) id: number,
    @Body({ schema: lineOrderSchema }) body: LineOrderBody,
    @CurrentUser() actor: Principal,
  ): RepairOrderSummary {
    return this.repairOrders.reorderLines(id, body, actor);
  }

  /** The vehicle is picked up. */
  @Post(':id/close')
  @HttpCode(200)
  close(
    @Param('id', { schema: idParamSchema }) id: number,
    @CurrentUser() actor: Principal,
  ): RepairOrderSummary {
    return this.repairOrders.close(id, actor);
  }
}
