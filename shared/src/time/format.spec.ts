import { describe, expect, it } from 'vitest';
import { formatShopInstant } from './format.js';

describe('formatShopInstant', () => {
  it('names the time in the shop’s zone, daylight saving included', () => {
    // 2026-07-04 14:30 UTC is 9:30 AM CDT (UTC−5) in Chicago; 2026-12-05 15:30 UTC is 9:30 AM CST (UTC−6).
    expect(formatShopInstant(new Date('2026-07-04T14:30:00Z'), 'America/Chicago')).toBe(
      'Sat, Jul 4, 9:30 AM',
    );
    expect(formatShopInstant(new Date('2026-12-05T15:30:00Z'), 'America/Chicago')).toBe(
      'Sat, Dec 5, 9:30 AM',
    );
  });
});
