import { describe, expect, it } from 'vitest';
import {
  addIsoWeeks,
  firstWorkweekFrom,
  isoWeekOf,
  isoWeekSchema,
  parseIsoWeek,
  shopDayKey,
  shopLocalInstant,
  workweekBounds,
  workweekDays,
  workweekName,
  workweekOf,
} from './workweek.js';

const CHICAGO = 'America/Chicago';
const mondayStart = { timeZone: CHICAGO, workweekStartDay: 1, workweekStartHour: 0 };
const sundayStart = { timeZone: CHICAGO, workweekStartDay: 0, workweekStartHour: 0 };
const hours = ({ from, to }: { from: Date; to: Date }) => (to.getTime() - from.getTime()) / 3_600_000;
const noon = (day: string) => shopLocalInstant(day, '12:00', CHICAGO);

describe(isoWeekOf.name, () => {
  // ISO 8601 week dates: Monday start, week 1 holds the year's first Thursday.
  it.each([
    ['2025-12-29', '2026-W01'],
    ['2026-12-31', '2026-W53'],
    ['2027-01-04', '2027-W01'],
    ['2005-01-01', '2004-W53'],
    ['2012-12-31', '2013-W01'],
    ['2003-12-29', '2004-W01'],
  ])('puts %s in %s', (day, week) => {
    expect(isoWeekOf(noon(day), CHICAGO)).toBe(week);
  });

  it('reads the week in the shop time zone, not in UTC', () => {
    // Sunday 2026-03-01 20:00 in Chicago is already Monday (W10) in UTC.
    const instant = shopLocalInstant('2026-03-01', '20:00', CHICAGO);
    expect(isoWeekOf(instant, CHICAGO)).toBe('2026-W09');
    expect(isoWeekOf(instant, 'UTC')).toBe('2026-W10');
  });
});

describe(parseIsoWeek.name, () => {
  it('accepts 2026-W53 because 2026 has 53 ISO weeks (ISO 8601: 2026-12-31 is 2026-W53-4)', () => {
    expect(parseIsoWeek('2026-W53')).toEqual({ year: 2026, week: 53 });
  });

  it.each(['2027-W53', '2026-W00', '2026-W54', '2026-W5', '2026W05', '2026-w05', ''])(
    'refuses %j',
    (label) => {
      expect(parseIsoWeek(label)).toBeNull();
      expect(isoWeekSchema.safeParse(label).success).toBe(false);
    },
  );

  it('validates with isoWeekSchema', () => {
    expect(isoWeekSchema.parse('2026-W01')).toBe('2026-W01');
  });
});

describe(addIsoWeeks.name, () => {
  it('steps across a 53-week year', () => {
    expect(addIsoWeeks('2026-W52', 1)).toBe('2026-W53');
    expect(addIsoWeeks('2026-W53', 1)).toBe('2027-W01');
    expect(addIsoWeeks('2027-W01', -1)).toBe('2026-W53');
  });
});

describe(workweekBounds.name, () => {
  it('is exactly the ISO week when the shop starts Monday 00:00', () => {
    // ISO 8601 week dates: 2025-12-29 is 2026-W01-1 and 2027-01-04 is 2027-W01-1, so W53 ends on 2027-01-04.
    expect(workweekBounds('2026-W01', mondayStart).from).toEqual(
      shopLocalInstant('2025-12-29', '00:00', CHICAGO),
    );
    expect(workweekBounds('2026-W53', mondayStart).to).toEqual(
      shopLocalInstant('2027-01-04', '00:00', CHICAGO),
    );
  });

  // US DST, Energy Policy Act of 2005 (Pub. L. 109-58 §110): 8 March and 1 November 2026;
  // 29 CFR 778.105: the workweek may start on any day and hour.
  it('lasts 167 h for the Sunday-start week from 2026-03-08 in America/Chicago', () => {
    const week = workweekBounds('2026-W10', sundayStart);
    expect(week.from).toEqual(shopLocalInstant('2026-03-08', '00:00', CHICAGO));
    expect(hours(week)).toBe(167);
  });

  it('lasts 169 h for the Sunday-start week from 2026-11-01 in America/Chicago', () => {
    const week = workweekBounds('2026-W44', sundayStart);
    expect(week.from).toEqual(shopLocalInstant('2026-11-01', '00:00', CHICAGO));
    expect(hours(week)).toBe(169);
  });

  it('lasts 168 h in an ordinary week, starting at the shop start hour', () => {
    const week = workweekBounds('2026-W20', { timeZone: CHICAGO, workweekStartDay: 3, workweekStartHour: 6 });
    expect(week.from).toEqual(shopLocalInstant('2026-05-13', '06:00', CHICAGO));
    expect(hours(week)).toBe(168);
  });

  it('chains weeks with no gap or overlap', () => {
    expect(workweekBounds('2026-W10', sundayStart).to).toEqual(workweekBounds('2026-W11', sundayStart).from);
  });

  it('throws on a week that does not exist', () => {
    expect(() => workweekBounds('2027-W53', mondayStart)).toThrow(RangeError);
  });
});

describe(workweekOf.name, () => {
  it('gives the week whose bounds hold the instant', () => {
    // Monday 2026-03-09 lies in ISO W11 but in the Sunday-start workweek that began in W10.
    expect(workweekOf(noon('2026-03-09'), sundayStart)).toBe('2026-W10');
    expect(workweekOf(noon('2026-03-08'), sundayStart)).toBe('2026-W10');
    expect(workweekOf(noon('2026-03-07'), sundayStart)).toBe('2026-W09');
    expect(workweekOf(noon('2026-03-09'), mondayStart)).toBe('2026-W11');
  });

  it('switches exactly at the start instant', () => {
    const settings = { timeZone: CHICAGO, workweekStartDay: 1, workweekStartHour: 6 };
    const start = workweekBounds('2026-W11', settings).from;
    expect(workweekOf(start, settings)).toBe('2026-W11');
    expect(workweekOf(new Date(start.getTime() - 1), settings)).toBe('2026-W10');
  });
});

describe(shopDayKey.name, () => {
  it('gives the local calendar day', () => {
    const lateEvening = shopLocalInstant('2026-03-07', '23:00', CHICAGO);
    expect(shopDayKey(lateEvening, CHICAGO)).toBe('2026-03-07');
    expect(shopDayKey(lateEvening, 'UTC')).toBe('2026-03-08');
  });
});

describe(shopLocalInstant.name, () => {
  // US Department of Labor hours-worked guidance on daylight saving time: an 11:00 pm–7:30 am shift with a
  // 30-minute lunch is 7 h on spring-forward night and 9 h on fall-back night.
  it.each([
    ['2026-03-07', '2026-03-08', 7],
    ['2026-10-31', '2026-11-01', 9],
  ])('counts the overnight shift from %s to %s as %i h', (start, end, expected) => {
    const shift = {
      from: shopLocalInstant(start, '23:00', CHICAGO),
      to: shopLocalInstant(end, '07:30', CHICAGO),
    };
    expect(hours(shift) - 0.5).toBe(expected);
  });
});

describe(workweekDays.name, () => {
  it('lists seven local days from the start day, the DST day 23 h long', () => {
    const days = workweekDays('2026-W10', sundayStart);
    expect(days.map((d) => d.day)).toEqual([
      '2026-03-08',
      '2026-03-09',
      '2026-03-10',
      '2026-03-11',
      '2026-03-12',
      '2026-03-13',
      '2026-03-14',
    ]);
    expect(days.map(hours)).toEqual([23, 24, 24, 24, 24, 24, 24]);
    expect(days[0]!.from).toEqual(workweekBounds('2026-W10', sundayStart).from);
    expect(days[6]!.to).toEqual(workweekBounds('2026-W10', sundayStart).to);
  });

  it('starts each workday at the shop start hour', () => {
    const days = workweekDays('2026-W44', { timeZone: CHICAGO, workweekStartDay: 0, workweekStartHour: 6 });
    expect(days[0]).toEqual({
      day: '2026-11-01',
      from: shopLocalInstant('2026-11-01', '06:00', CHICAGO),
      to: shopLocalInstant('2026-11-02', '06:00', CHICAGO),
    });
  });
});

describe(workweekName.name, () => {
  // ISO 8601: 2026-W48 runs Mon Nov 23 – Sun Nov 29; a Sunday-start shop week that starts in it begins on
  // Sunday Nov 29 (US DST ended on Nov 1, Pub. L. 109-58 §110, so it is a plain 168 h week).
  it('names a Sunday-start workweek by its first day, not by the ISO week', () => {
    expect(workweekName('2026-W48', sundayStart)).toBe('Week of Sun, Nov 29');
    expect(workweekName('2026-W48', mondayStart)).toBe('Week of Mon, Nov 23');
    expect(workweekName('2026-W53', sundayStart, true)).toBe('Week of Sun, Jan 3, 2027');
  });
});

describe(firstWorkweekFrom.name, () => {
  // Wednesday Oct 14, 2026 falls in the Sunday-start week of Oct 11: a rate dated then first covers the week
  // that begins Sunday Oct 18 (the 2026 calendar: Oct 1 was a Thursday).
  it('gives the week that begins on the day, or else the next one to begin', () => {
    expect(workweekName(firstWorkweekFrom('2026-10-14', sundayStart), sundayStart)).toBe(
      'Week of Sun, Oct 18',
    );
    expect(workweekName(firstWorkweekFrom('2026-10-18', sundayStart), sundayStart)).toBe(
      'Week of Sun, Oct 18',
    );
    expect(workweekName(firstWorkweekFrom('2026-10-19', mondayStart), mondayStart)).toBe(
      'Week of Mon, Oct 19',
    );
  });
});
