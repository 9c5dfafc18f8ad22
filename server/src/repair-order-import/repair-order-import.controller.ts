import { Body, Controller, HttpCode, Post } from '@nestjs/common';
import {
  repairOrderImportSchema,
  type RepairOrderImportBody,
  type RepairOrderImportResult,
} from '@baytime/shared';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { RepairOrderImportService } from './repair-order-import.service.js';

@Roles('owner', 'foreman', 'advisor')
@Controller('repair-order-imports')
export class RepairOrderImportController {
  constructor(private readonly imports: RepairOrderImportService) {}

  /** What the file would write, with every error at its row and column; nothing is saved. */
  @HttpCode(200)
  @Post('preview')
  preview(
    @Body({ schema: repairOrderImportSchema }) body: RepairOrderImportBody,
    @CurrentUser() actor: Principal,
  ): RepairOrderImportResult {
    return this.imports.preview(body, actor);
  }

  @Post()
  import(
    @Body({ schema: repairOrderImportSchema }) body: RepairOrderImportBody,
    @CurrentUser() actor: Principal,
  ): RepairOrderImportResult {
    return this.imports.import(body, actor);
  }
}
