import { afterEach, describe, expect, it, vi } from 'vitest';
import { retryDelayMs } from './retry-delay.js';

describe(retryDelayMs.name, () => {
  afterEach(() => {
    vi.restoreAllMocks();
  });

  it('doubles from the first wait up to the longest', () => {
    const policy = { firstMs: 1_000, maxMs: 10_000 };
    expect([1, 2, 3, 4, 5, 30].map((failed) => retryDelayMs(failed, policy))).toEqual([
      1_000, 2_000, 4_000, 8_000, 10_000, 10_000,
    ]);
  });

  it('spreads waits with jitter, never below the plain wait nor above twice it', () => {
    const policy = { firstMs: 1_000, maxMs: 60_000, jitter: true };
    const waits = Array.from({ length: 50 }, () => retryDelayMs(3, policy));
    expect(Math.min(...waits)).toBeGreaterThanOrEqual(4_000);
    expect(Math.max(...waits)).toBeLessThanOrEqual(8_000);
    expect(new Set(waits).size).toBeGreaterThan(1);
  });

  it('rounds the jittered wait to whole milliseconds, so its top is twice the plain wait', () => {
    const policy = { firstMs: 1_000, maxMs: 60_000, jitter: true };
    vi.spyOn(Math, 'random').mockReturnValue(0);
    expect(retryDelayMs(3, policy)).toBe(4_000);
    vi.spyOn(Math, 'random').mockReturnValue(0.9999999);
    expect(retryDelayMs(3, policy)).toBe(8_000);
  });
});
