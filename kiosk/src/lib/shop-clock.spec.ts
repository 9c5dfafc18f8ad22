// @vitest-environment node
import { describe, expect, it } from 'vitest';
import { localDay, sinceTime } from './shop-clock';

// America/Chicago is UTC−6 in winter (CST).
const ZONE = 'America/Chicago';

describe(localDay.name, () => {
  it('gives the calendar day in the shop’s zone, not UTC', () => {
    expect(localDay('2026-12-01T03:30:00.000Z', ZONE)).toBe('2026-11-30');
  });
});

describe(sinceTime.name, () => {
  const now = Date.parse('2026-11-30T14:00:00.000Z'); // Monday 8:00 am in Chicago
  it('gives only the time for today in the shop’s zone', () => {
    expect(sinceTime('2026-11-30T13:02:00.000Z', now, ZONE)).toBe('7:02 am');
  });
  it('names the day of a time before today, even one only hours ago', () => {
    expect(sinceTime('2026-11-27T13:30:00.000Z', now, ZONE)).toBe('Fri, Nov 27, 7:30 am');
    // 11:30 pm on Sunday in Chicago, though Monday already in UTC.
    expect(sinceTime('2026-11-30T05:30:00.000Z', now, ZONE)).toBe('Sun, Nov 29, 11:30 pm');
  });
});
