import { Body, Controller, Get, Patch } from '@nestjs/common';
import {
  updateShopSchema,
  type DatedPayRules,
  type ShopSettings,
  type UpdateShopBody,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { ShopService } from './shop.service.js';

@Controller('shop')
export class ShopController {
  constructor(private readonly shop: ShopService) {}

  @Get()
  get(): ShopSettings {
    return this.shop.settings();
  }

  /** Every dated set of pay rules, oldest first: each applies to the weeks that begin from its date on. */
  @Roles('owner')
  @Get('pay-rules')
  payRules(): DatedPayRules[] {
    return this.shop.payRulesHistory();
  }

  @Roles('owner')
  @Patch()
  update(
    @Body({ schema: updateShopSchema }) body: UpdateShopBody,
    @CurrentUser() actor: Principal,
  ): ShopSettings {
    return this.shop.update(body, actor);
  }
}
