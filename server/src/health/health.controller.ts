import { Controller, Get } from '@nestjs/common';
import { createRequire } from 'node:module';
import { Public } from '../common/decorators/auth.decorators.js';

const { version } = createRequire(import.meta.url)('../../package.json') as { version: string };

@Controller('health')
export class HealthController {
  /** Nest only routes requests after every module started, so migrations have run by now. */
  @Public()
  @Get()
  health(): { ok: true; version: string } {
    return { ok: true, version };
  }
}
