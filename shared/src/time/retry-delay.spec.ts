import { describe, expect, it } from 'vitest';
import { retryDelayMs } from './retry-delay.js';

describe(retryDelayMs.name, () => {
  it('doubles from the first wait up to the longest', () => {
    const policy = { firstMs: 1_000, maxMs: 10_000 };
    expect([1, 2, 3, 4, 5, 30].map((failed) => retryDelayMs(failed, policy))).toEqual([
      1_000, 2_000, 4_000, 8_000, 10_000, 10_000,
    ]);
  });

  it('spreads waits with jitter, never below the plain wait nor above the longest', () => {
    const policy = { firstMs: 1_000, maxMs: 60_000, jitter: true };
    const waits = Array.from({ length: 50 }, () => retryDelayMs(3, policy));
    expect(Math.min(...waits)).toBeGreaterThanOrEqual(4_000);
    expect(Math.max(...waits)).toBeLessThan(8_000);
    expect(new Set(waits).size).toBeGreaterThan(1);
  });
});
