import { Inject, Injectable, NotFoundException, type OnModuleDestroy } from '@nestjs/common';
import { monitorEventLoopDelay, type IntervalHistogram } from 'node:perf_hooks';
import { APP_CONFIG, type AppConfig } from '../config/app-config.js';

/** Event-loop delay in milliseconds since the previous read. */
export interface EventLoopDelay {
  samples: number;
  meanMs: number;
  p50Ms: number;
  p90Ms: number;
  p99Ms: number;
  maxMs: number;
}

const ms = (nanoseconds: number) => Math.round(nanoseconds / 1e4) / 100;

/**
 * How long callbacks waited for the event loop, measured inside the server for `npm run bench`. Off
 * unless `BAYTIME_BENCH_METRICS` is set: then the route answers 404 and nothing is sampled.
 */
@Injectable()
export class EventLoopService implements OnModuleDestroy {
  private readonly histogram: IntervalHistogram | null;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.histogram = config.benchMetrics ? monitorEventLoopDelay({ resolution: 10 }) : null;
    this.histogram?.enable();
  }

  onModuleDestroy(): void {
    this.histogram?.disable();
  }

  /** The delays since the last read, then starts counting again. */
  read(): EventLoopDelay {
    const histogram = this.histogram;
    if (!histogram) throw new NotFoundException('Not found');
    const delay: EventLoopDelay = {
      samples: histogram.count,
      meanMs: histogram.count ? ms(histogram.mean) : 0,
      p50Ms: ms(histogram.percentile(50)),
      p90Ms: ms(histogram.percentile(90)),
      p99Ms: ms(histogram.percentile(99)),
      maxMs: ms(histogram.max),
    };
    histogram.reset();
    return delay;
  }
}
