import { Controller, Get } from '@nestjs/common';
import { createRequire } from 'node:module';
import { Public } from '../common/decorators/auth.decorators.js';
import { EventLoopService, type EventLoopDelay } from './event-loop.service.js';

const { version } = createRequire(import.meta.url)('../../package.json') as { version: string };

@Controller('health')
export class HealthController {
  constructor(private readonly eventLoop: EventLoopService) {}

  /** Nest only routes requests after every module started, so migrations have run by now. */
  @Public()
  @Get()
  health(): { ok: true; version: string } {
    return { ok: true, version };
  }

  /** Only with `BAYTIME_BENCH_METRICS=1`; 404 otherwise. */
  @Public()
  @Get('event-loop')
  eventLoopDelay(): EventLoopDelay {
    return this.eventLoop.read();
  }
}
