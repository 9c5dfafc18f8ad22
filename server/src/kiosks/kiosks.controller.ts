import { Body, Controller, Delete, Get, HttpCode, Param, Post } from '@nestjs/common';
import {
  createScreenSchema,
  kioskQueueSchema,
  offlinePunchSchema,
  type CreateScreenBody,
  type KioskDto,
  type KioskQueueBody,
  type OfflineKeyDto,
  type OfflinePunchBody,
  type ScreenPairing,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { ScreensService, type ScreenDto } from '../screens/screens.service.js';
import { OfflineKeyService } from './offline-key.service.js';
import { OfflinePunchesService } from './offline-punches.service.js';

/** Kiosk tablets: paired in Admin like wall screens; a paired kiosk reports its queue and sends offline punches. */
@Controller('kiosks')
export class KiosksController {
  constructor(
    private readonly screens: ScreensService,
    private readonly key: OfflineKeyService,
    private readonly offline: OfflinePunchesService,
  ) {}

  @Roles('owner', 'foreman')
  @Get()
  list(): KioskDto[] {
    return this.screens.kiosks();
  }

  @Roles('owner', 'foreman')
  @Post()
  create(
    @Body({ schema: createScreenSchema }) body: CreateScreenBody,
    @CurrentUser() actor: Principal,
  ): ScreenPairing {
    return this.screens.create(body, actor, 'kiosk');
  }

  @Roles('owner', 'foreman')
  @Delete(':id')
  revoke(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): ScreenDto {
    return this.screens.revoke(id, actor, 'kiosk');
  }

  @Roles('kiosk')
  @Get('me/offline-key')
  offlineKey(): OfflineKeyDto {
    return this.key.publicKey();
  }

  @Roles('kiosk')
  @Post('me/queue')
  @HttpCode(204)
  reportQueue(
    @Body({ schema: kioskQueueSchema }) body: KioskQueueBody,
    @CurrentUser() kiosk: Principal,
  ): void {
    this.screens.reportQueue(kiosk.id, body);
  }

  /** 202 whatever the PIN: the kiosk learns only that the punch arrived. */
  @Roles('kiosk')
  @Post('me/offline-punches')
  @HttpCode(202)
  offlinePunch(
    @Body({ schema: offlinePunchSchema }) body: OfflinePunchBody,
    @CurrentUser() kiosk: Principal,
  ): Promise<{ id: string }> {
    return this.offline.receive(body, kiosk);
  }
}
