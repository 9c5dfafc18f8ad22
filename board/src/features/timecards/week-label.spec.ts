import { describe, expect, it } from 'vitest';
import { currentWeek, isAfterWeek, readWeek, shiftWeek, weekName, weekRangeText } from './week-label';

const chicagoSunday = { timeZone: 'America/Chicago', workweekStartDay: 0, workweekStartHour: 0 };
const mondayUtc = { timeZone: 'UTC', workweekStartDay: 1, workweekStartHour: 0 };

describe('week labels', () => {
  it('accepts only ISO weeks that exist', () => {
    expect(readWeek('2026-W48')).toBe('2026-W48');
    // ISO 8601: 2026 has 53 weeks, 2027 has 52.
    expect(readWeek('2026-W53')).toBe('2026-W53');
    expect(readWeek('2027-W53')).toBeNull();
    expect(readWeek('2026-48')).toBeNull();
    expect(readWeek(null)).toBeNull();
  });

  it('steps across the turn of the year', () => {
    expect(shiftWeek('2026-W53', 1)).toBe('2027-W01');
    expect(shiftWeek('2027-W01', -1)).toBe('2026-W53');
  });

  it('compares labels in time order', () => {
    expect(isAfterWeek('2027-W01', '2026-W53')).toBe(true);
    expect(isAfterWeek('2026-W09', '2026-W10')).toBe(false);
  });

  it('finds the workweek that holds an instant', () => {
    // ISO 8601: 2025-12-29 is 2026-W01-1.
    expect(currentWeek(mondayUtc, new Date('2025-12-29T12:00:00Z'))).toBe('2026-W01');
    // A Sunday-start week: Sunday 2026-11-29 belongs to the week that starts in ISO week 48.
    expect(currentWeek(chicagoSunday, new Date('2026-11-29T18:00:00Z'))).toBe('2026-W48');
  });

  it('writes the dates the shop week covers', () => {
    expect(weekRangeText('2026-W48', chicagoSunday)).toBe('Sun, Nov 29 – Sat, Dec 5, 2026');
    expect(weekRangeText('2026-W01', mondayUtc)).toBe('Mon, Dec 29 – Sun, Jan 4, 2026');
    // The Sunday-start week that starts in ISO week 48 begins on Sunday Nov 29, not in "week 48".
    expect(weekName('2026-W48', chicagoSunday)).toBe('Week of Sun, Nov 29');
  });
});
