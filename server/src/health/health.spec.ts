import { afterAll, describe, expect, it } from 'vitest';
import { startTestApp, type TestApp } from '../test-support/test-app.js';
import type { EventLoopDelay } from './event-loop.service.js';

describe('GET /api/health/event-loop', () => {
  const apps: TestApp[] = [];
  afterAll(async () => {
    for (const app of apps) await app.close();
  });

  it('answers 404 unless BAYTIME_BENCH_METRICS is set', async () => {
    const sut = await startTestApp();
    apps.push(sut);
    await sut.http().get('/api/health').expect(200);
    await sut.http().get('/api/health/event-loop').expect(404);
  });

  it('with BAYTIME_BENCH_METRICS=1, reports a stall of the event loop in milliseconds', async () => {
    const sut = await startTestApp({ BAYTIME_BENCH_METRICS: '1' });
    apps.push(sut);
    const pause = () => new Promise((resolve) => setTimeout(resolve, 30));
    await sut.http().get('/api/health/event-loop').expect(200);
    // After a read the monitor needs one tick to start again; then hold the loop for 80 ms.
    await pause();
    const until = Date.now() + 80;
    while (Date.now() < until);
    await pause();
    const { body } = await sut.http().get('/api/health/event-loop').expect(200);
    const delay = body as EventLoopDelay;
    expect(delay.samples).toBeGreaterThan(0);
    // The 80 ms less the sampling interval (10 ms), less a millisecond of Date.now's grain and timer jitter.
    expect(delay.maxMs).toBeGreaterThanOrEqual(65);
    expect(delay.p99Ms).toBeLessThanOrEqual(delay.maxMs);
    // Most samples came while the loop was free: their delay is nothing, not the 10 ms sampling interval.
    expect(delay.p50Ms).toBeLessThan(10);
  });
});
