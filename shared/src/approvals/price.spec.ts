import { describe, expect, it } from 'vitest';
import { findingPrice, formatCents } from './price.js';

describe('findingPrice', () => {
  it('charges book hours at the labour rate, plus parts', () => {
    // 1.2 h × $135.50 = $162.60; + $48.95 parts = $211.55 (worked by hand).
    expect(findingPrice(1.2, 135_50, 48_95)).toEqual({
      labourCents: 162_60,
      partsCents: 48_95,
      priceCents: 211_55,
    });
  });

  it('rounds the labour to the cent once, a half cent up', () => {
    // 0.7 h × $123.45 = $86.415 → $86.42; 0.3 h × $99.99 = $29.997 → $30.00 (worked by hand).
    expect(findingPrice(0.7, 123_45, null)).toEqual({ labourCents: 86_42, partsCents: 0, priceCents: 86_42 });
    expect(findingPrice(0.3, 99_99, 0).priceCents).toBe(30_00);
  });

  it('rounds the exact decimal product, not its floating-point neighbour', () => {
    // 1.005 h × $1.00 = 100.5 cents → 101; in floating point 1.005 × 100 is 100.49999999999999.
    expect(findingPrice(1.005, 100, null).labourCents).toBe(101);
    // 2.3 h × $110.00 = $253.00 exactly (worked by hand).
    expect(findingPrice(2.3, 110_00, null).labourCents).toBe(253_00);
  });
});

describe('formatCents', () => {
  it('writes dollars and cents with separators', () => {
    expect(formatCents(123_450)).toBe('$1,234.50');
    expect(formatCents(0)).toBe('$0.00');
  });
});
