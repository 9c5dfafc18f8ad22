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

/** How often the histogram's timer asks to run, in ms. */
const RESOLUTION_MS = 10;
/**
 * Node records the whole interval between two runs of its sampling timer, so an idle loop reads as
 * the resolution itself (10 ms); the delay is what lies beyond it.
 */
const delayMs = (nanoseconds: number) => Math.max(0, Math.round(nanoseconds / 1e4) / 100 - RESOLUTION_MS);

/**
 * How long callbacks waited for the event loop, measured inside the server for `npm run bench`. Off
 * unless `BAYTIME_BENCH_METRICS` is set: then the route answers 404 and nothing is sampled.
 */
@Injectable()
export class EventLoopService implements OnModuleDestroy {
  private readonly histogram: IntervalHistogram | null;

  constructor(@Inject(APP_CONFIG) config: AppConfig) {
    this.histogram = config.benchMetrics ? monitorEventLoopDelay({ resolution: RESOLUTION_MS }) : null;
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
      meanMs: histogram.count ? delayMs(histogram.mean) : 0,
      p50Ms: delayMs(histogram.percentile(50)),
      p90Ms: delayMs(histogram.percentile(90)),
      p99Ms: delayMs(histogram.percentile(99)),
      maxMs: delayMs(histogram.max),
    };
    histogram.reset();
    return delay;
  }
}
