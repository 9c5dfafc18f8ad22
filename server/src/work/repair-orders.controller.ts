import { Body, Controller, Get, HttpCode, Param, Patch, Post, Put, Query } from '@nestjs/common';
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

  @Get(':id/history')
  history(@Param('id', { schema: idParamSchema }) id: number): RepairOrderHistoryEntry[] {
    return this.repairOrders.history(id);
  }

  @Post()
  create(
    @Body({ schema: createRepairOrderSchema }) body: CreateRepairOrderBody,
    @CurrentUser() actor: Principal,
  ): RepairOrderSummary {
    return this.repairOrders.create(body, actor);
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
