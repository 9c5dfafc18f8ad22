import { afterEach, describe, expect, it } from 'vitest';
import { setShopClockFormat } from '@/lib/shop-clock';
import { formatSpan, formatTimeOfDay } from './board-time';

describe('duration formats', () => {
  it('writes spans short', () => {
    expect(formatSpan(30)).toBe('<1m');
    expect(formatSpan(42 * 60)).toBe('42m');
    expect(formatSpan(65 * 60)).toBe('1h 05m');
    expect(formatSpan(51 * 3600)).toBe('2d 3h');
  });
});

describe(formatTimeOfDay.name, () => {
  afterEach(() => setShopClockFormat('12h'));

  // 2026-03-08 is the US spring-forward day (Energy Policy Act of 2005, §110): 08:30 UTC is 3:30 a.m. CDT.
  it('shows the time in the shop zone, across a DST change, as the shop reads clocks', () => {
    expect(formatTimeOfDay(Date.parse('2026-03-08T07:30:00Z'), 'America/Chicago')).toBe('1:30 am');
    expect(formatTimeOfDay(Date.parse('2026-03-08T08:30:00Z'), 'America/Chicago')).toBe('3:30 am');
    setShopClockFormat('24h');
    expect(formatTimeOfDay(Date.parse('2026-03-02T15:04:00Z'), 'America/Chicago')).toBe('09:04');
  });
});
