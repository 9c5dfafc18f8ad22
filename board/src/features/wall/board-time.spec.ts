import { describe, expect, it } from 'vitest';
import { clockFace, formatCountdown, formatHoursMinutes, formatSpan, formatTimeOfDay } from './board-time';

describe('duration formats', () => {
  it('writes labour time as h:mm', () => {
    expect(formatHoursMinutes(0)).toBe('0:00');
    expect(formatHoursMinutes(3 * 60 + 59)).toBe('0:03');
    expect(formatHoursMinutes(5400)).toBe('1:30');
    expect(formatHoursMinutes(-20)).toBe('0:00');
  });

  it('writes countdowns with seconds', () => {
    expect(formatCountdown(245)).toBe('4:05');
    expect(formatCountdown(3845)).toBe('1:04:05');
    expect(formatCountdown(0.2)).toBe('0:01');
  });

  it('writes spans short', () => {
    expect(formatSpan(30)).toBe('<1m');
    expect(formatSpan(42 * 60)).toBe('42m');
    expect(formatSpan(65 * 60)).toBe('1h 05m');
    expect(formatSpan(51 * 3600)).toBe('2d 3h');
  });
});

describe(clockFace.name, () => {
  // 2026-03-08 is the US spring-forward day (Energy Policy Act of 2005, §110): 08:30 UTC is 3:30 a.m. CDT.
  it('shows the time in the shop zone, across a DST change', () => {
    expect(clockFace(Date.parse('2026-03-08T07:30:00Z'), 'America/Chicago', 'en-US')).toEqual({
      time: '1:30',
      period: 'AM',
    });
    expect(clockFace(Date.parse('2026-03-08T08:30:00Z'), 'America/Chicago', 'en-US')).toEqual({
      time: '3:30',
      period: 'AM',
    });
  });

  it('has no period in a 24-hour locale and survives an unknown zone', () => {
    expect(clockFace(Date.parse('2026-03-02T15:04:00Z'), 'UTC', 'en-GB')).toEqual({
      time: '15:04',
      period: '',
    });
    // An unknown zone shows the screen's own zone rather than blanking the clock.
    expect(clockFace(0, 'Nowhere/Atlantis', 'en-US')).toEqual(clockFace(0, undefined, 'en-US'));
    expect(formatTimeOfDay(Date.parse('2026-03-02T15:04:00Z'), 'America/Chicago', 'en-US')).toBe('9:04 AM');
  });
});
