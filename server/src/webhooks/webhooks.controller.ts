import { Body, Controller, Delete, Get, Param, Post, Query } from '@nestjs/common';
import {
  createWebhookSchema,
  pageQuerySchema,
  type CreatedWebhook,
  type CreateWebhookBody,
  type Page,
  type PageQuery,
  type WebhookDeliveryDto,
  type WebhookDto,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { WebhooksService } from './webhooks.service.js';

@Roles('owner')
@Controller('webhooks')
export class WebhooksController {
  constructor(private readonly webhooks: WebhooksService) {}

  @Get()
  list(): WebhookDto[] {
    return this.webhooks.list();
  }

  @Post()
  create(
    @Body({ schema: createWebhookSchema }) body: CreateWebhookBody,
    @CurrentUser() actor: Principal,
  ): CreatedWebhook {
    return this.webhooks.create(body, actor);
  }

  @Delete(':id')
  revoke(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): WebhookDto {
    return this.webhooks.revoke(id, actor);
  }

  @Get('deliveries')
  deliveries(@Query({ schema: pageQuerySchema }) query: PageQuery): Page<WebhookDeliveryDto> {
    return this.webhooks.deliveries(query);
  }
}
