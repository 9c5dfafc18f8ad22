import { describe, expect, it } from 'vitest';
import {
  clockParts,
  formatBookHours,
  formatClockTime,
  formatCountdown,
  formatHours,
  formatShopInstant,
  hoursFigure,
  waitWords,
} from './format.js';

describe('formatShopInstant', () => {
  it('names the time in the shop’s zone, daylight saving included', () => {
    // 2026-07-04 14:30 UTC is 9:30 AM CDT (UTC−5) in Chicago; 2026-12-05 15:30 UTC is 9:30 AM CST (UTC−6).
    expect(formatShopInstant(new Date('2026-07-04T14:30:00Z'), 'America/Chicago')).toBe(
      'Sat, Jul 4, 9:30 am',
    );
    expect(formatShopInstant(new Date('2026-12-05T15:30:00Z'), 'America/Chicago')).toBe(
      'Sat, Dec 5, 9:30 am',
    );
    expect(formatShopInstant(new Date('2026-12-05T21:05:00Z'), 'America/Chicago', '24h')).toBe(
      'Sat, Dec 5, 15:05',
    );
  });
});

describe('clock times', () => {
  // 2026-12-05 21:05 UTC is 3:05 PM CST (UTC−6) in Chicago, and 00:05 the next day in Moscow (UTC+3).
  const afternoon = '2026-12-05T21:05:00Z';

  it('reads am/pm or 24 h as the shop chose', () => {
    expect(formatClockTime(afternoon, 'America/Chicago', '12h')).toBe('3:05 pm');
    expect(formatClockTime(afternoon, 'America/Chicago', '24h')).toBe('15:05');
    expect(formatClockTime(afternoon, 'Europe/Moscow', '24h')).toBe('00:05');
    expect(formatClockTime(afternoon, 'Europe/Moscow', '12h')).toBe('12:05 am');
    expect(clockParts(afternoon, 'America/Chicago', '12h')).toEqual({ time: '3:05', period: 'pm' });
    expect(clockParts(afternoon, 'America/Chicago', '24h')).toEqual({ time: '15:05', period: '' });
  });

  it('falls back to the device’s zone for an unknown zone name', () => {
    expect(formatClockTime(afternoon, 'Nowhere/Atlantis', '24h')).toMatch(/^\d\d:05$/);
  });
});

describe('labour and countdowns', () => {
  it('gives labour in decimal hours', () => {
    expect(formatHours(4320)).toBe('1.2 h');
    expect(formatHours(8 * 3600 + 5 * 60)).toBe('8.08 h');
    expect(formatHours(3 * 3600)).toBe('3.0 h');
    expect(formatHours(-60)).toBe('0.0 h');
    expect(formatBookHours(1.5)).toBe('1.5 h');
    expect(hoursFigure(1.86, 1)).toBe('1.9');
    expect(hoursFigure(3, 1)).toBe('3.0');
  });

  it('counts down in minutes and seconds, rounding up', () => {
    expect(formatCountdown(245)).toBe('4:05');
    expect(formatCountdown(0.2)).toBe('0:01');
    expect(formatCountdown(3845)).toBe('1:04:05');
    expect(formatCountdown(-3)).toBe('0:00');
  });
});

describe(waitWords.name, () => {
  it('grows from minutes to hours to days, counting whole minutes waited', () => {
    const now = Date.parse('2026-12-01T16:10:00Z');
    const waited = (since: string) => waitWords(Date.parse(since), now);
    expect(waited('2026-12-01T16:09:40Z')).toBe('just now');
    expect(waited('2026-12-01T16:00:30Z')).toBe('9 min');
    expect(waited('2026-12-01T14:00:00Z')).toBe('2 h 10 min');
    expect(waited('2026-12-01T14:10:00Z')).toBe('2 h');
    expect(waited('2026-11-30T15:00:00Z')).toBe('1 day 1 h');
    expect(waited('2026-11-28T16:00:00Z')).toBe('3 days');
    expect(waited('2026-12-01T16:20:00Z')).toBe('just now');
  });
});
