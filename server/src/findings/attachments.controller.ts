import { Controller, Get, Header, Param, type StreamableFile } from '@nestjs/common';
import type { Principal } from '../auth/principal.js';
import { CurrentUser, Roles } from '../common/decorators/auth.decorators.js';
import { idParamSchema } from '../common/id-param.js';
import { FindingsService } from './findings.service.js';

/** Finding photos: the office sees all; a technician those on repair orders they work on. */
@Roles('owner', 'foreman', 'advisor', 'technician')
@Controller('attachments')
export class AttachmentsController {
  constructor(private readonly findings: FindingsService) {}

  @Get(':id')
  @Header('X-Content-Type-Options', 'nosniff')
  @Header('Cache-Control', 'private, max-age=86400')
  photo(@Param('id', { schema: idParamSchema }) id: number, @CurrentUser() actor: Principal): StreamableFile {
    return this.findings.photo(id, 'original', actor);
  }

  @Get(':id/preview')
  @Header('X-Content-Type-Options', 'nosniff')
  @Header('Cache-Control', 'private, max-age=86400')
  preview(
    @Param('id', { schema: idParamSchema }) id: number,
    @CurrentUser() actor: Principal,
  ): StreamableFile {
    return this.findings.photo(id, 'preview', actor);
  }
}
