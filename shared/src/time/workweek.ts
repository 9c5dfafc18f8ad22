import { TZDate } from '@date-fns/tz';
// One module per function: the package index would load all of date-fns (about 300 modules) at start-up.
import { addWeeks } from 'date-fns/addWeeks';
import { format } from 'date-fns/format';
import { getISOWeeksInYear } from 'date-fns/getISOWeeksInYear';
import { startOfISOWeek } from 'date-fns/startOfISOWeek';
import { z } from 'zod';
import { EARLIEST_DATE, latestDate } from '../input/fields.js';
import type { ShopSettings } from '../shop/shop.schema.js';

export type WorkweekSettings = Pick<ShopSettings, 'timeZone' | 'workweekStartDay' | 'workweekStartHour'>;

export interface TimeRange {
  from: Date;
  to: Date;
}

export interface ShopDay extends TimeRange {
  /** Local calendar date the day starts on, 'YYYY-MM-DD'. */
  day: string;
}

const ISO_WEEK = /^(\d{4})-W(\d{2})$/;

/** `'2026-W53'` → `{ year: 2026, week: 53 }`; null when malformed or the year has no such week. */
export function parseIsoWeek(label: string): { year: number; week: number } | null {
  const match = ISO_WEEK.exec(label);
  if (!match) return null;
  const year = Number(match[1]);
  const week = Number(match[2]);
  const weeksInYear = getISOWeeksInYear(new Date(Date.UTC(year, 5, 1)));
  return week >= 1 && week <= weeksInYear ? { year, week } : null;
}

export const isoWeekSchema = z
  .string()
  .max(8)
  .refine((label) => parseIsoWeek(label) !== null, 'Use an ISO week that exists, like 2026-W05')
  .refine((label) => {
    const year = parseIsoWeek(label)?.year;
    return (
      year === undefined || (year >= EARLIEST_DATE.getUTCFullYear() && year <= latestDate().getUTCFullYear())
    );
  }, 'Use a week from 2000 to two years ahead');

function isoWeekMonday(label: string, timeZone: string): TZDate {
  const parsed = parseIsoWeek(label);
  if (!parsed) throw new RangeError(`Not an ISO week: ${label}`);
  // 4 January always lies in ISO week 1.
  return addWeeks(startOfISOWeek(new TZDate(parsed.year, 0, 4, timeZone)), parsed.week - 1);
}

/**
 * Remembers answers of pure calendar functions: time-zone arithmetic costs about a millisecond a
 * call, and reports ask the same weeks again and again.
 */
function memoize<A extends unknown[], R>(
  fn: (...args: A) => R,
  key: (...args: A) => string,
): (...args: A) => R {
  const cache = new Map<string, R>();
  return (...args: A) => {
    const k = key(...args);
    const hit = cache.get(k);
    if (hit !== undefined) return hit;
    if (cache.size > 5000) cache.clear();
    const value = fn(...args);
    cache.set(k, value);
    return value;
  };
}

const MINUTE_MS = 60_000;
/**
 * Since 1972 every zone's UTC offset is a whole number of minutes and changes on a whole minute, so an
 * instant's local calendar day is that of the minute it falls in.
 */
const minuteKey = (instant: Date, timeZone: string) =>
  `${timeZone}|${Math.floor(instant.getTime() / MINUTE_MS)}`;

/** ISO 8601 week label (Monday start, week 1 holds the first Thursday) of an instant, in a time zone. */
export const isoWeekOf: (instant: Date, timeZone: string) => string = memoize(
  (instant, timeZone) => format(new TZDate(instant, timeZone), "RRRR-'W'II"),
  minuteKey,
);

export const addIsoWeeks: (label: string, weeks: number) => string = memoize(
  (label, weeks) => isoWeekOf(addWeeks(isoWeekMonday(label, 'UTC'), weeks), 'UTC'),
  (label, weeks) => `${label}|${weeks}`,
);

function workweekStart(monday: TZDate, settings: WorkweekSettings, extraDays = 0): Date {
  const offset = (settings.workweekStartDay + 6) % 7; // days after Monday
  const local = new TZDate(
    monday.getFullYear(),
    monday.getMonth(),
    monday.getDate() + offset + extraDays,
    settings.workweekStartHour,
    0,
    0,
    settings.timeZone,
  );
  return new Date(local.getTime());
}

/**
 * The shop's workweek that starts within ISO week `label`, as UTC instants (`to` exclusive).
 * 29 CFR 778.105: a fixed recurring period starting on any day and hour; it starts at the same local
 * wall-clock time each week, so it lasts 167 or 169 h across a DST change.
 */
const cachedWorkweekBounds: (label: string, settings: WorkweekSettings) => TimeRange = memoize(
  (label, settings) => {
    const monday = isoWeekMonday(label, settings.timeZone);
    return { from: workweekStart(monday, settings), to: workweekStart(monday, settings, 7) };
  },
  (label, { timeZone, workweekStartDay, workweekStartHour }) =>
    `${label}|${timeZone}|${workweekStartDay}|${workweekStartHour}`,
);

export function workweekBounds(label: string, settings: WorkweekSettings): TimeRange {
  const { from, to } = cachedWorkweekBounds(label, settings);
  return { from: new Date(from), to: new Date(to) };
}

/**
 * A shop workweek in words, by its first local day: "Week of Sun, Nov 29" (with the year on request). The
 * `YYYY-Www` label names the shop workweek that starts in that ISO week, which is not the ISO week itself
 * when the shop's week starts on another day than Monday.
 */
export function workweekName(label: string, settings: WorkweekSettings, withYear = false): string {
  const { from } = cachedWorkweekBounds(label, settings);
  return `Week of ${format(new TZDate(from, settings.timeZone), withYear ? 'EEE, MMM d, yyyy' : 'EEE, MMM d')}`;
}

/** Label of the shop workweek that contains an instant. */
export function workweekOf(instant: Date, settings: WorkweekSettings): string {
  const label = isoWeekOf(instant, settings.timeZone);
  return instant < workweekBounds(label, settings).from ? addIsoWeeks(label, -1) : label;
}

/**
 * The first workweek that begins on or after a local day ('YYYY-MM-DD'): the first a pay rate dated that day
 * applies to, since a rate covers whole workweeks.
 */
export function firstWorkweekFrom(day: string, settings: WorkweekSettings): string {
  const label = workweekOf(shopLocalInstant(day, '12:00', settings.timeZone), settings);
  return workweekDays(label, settings)[0]!.day >= day ? label : addIsoWeeks(label, 1);
}

/** The local calendar day of an instant, 'YYYY-MM-DD'. */
export const shopDayKey: (instant: Date, timeZone: string) => string = memoize(
  (instant, timeZone) => format(new TZDate(instant, timeZone), 'yyyy-MM-dd'),
  minuteKey,
);

/** The instant of a local wall-clock time ('HH:MM') on a local day ('YYYY-MM-DD'). */
export function shopLocalInstant(day: string, time: string, timeZone: string): Date {
  const [year, month, date] = day.split('-').map(Number);
  const [hours, minutes] = time.split(':').map(Number);
  return new Date(new TZDate(year!, month! - 1, date!, hours!, minutes!, 0, timeZone).getTime());
}

/**
 * The seven workdays of a workweek, each from the start hour on one local day to the start hour on the
 * next (California Labor Code 500(a): a workday is a 24-hour period starting at the same time each day).
 */
export function workweekDays(label: string, settings: WorkweekSettings): ShopDay[] {
  const monday = isoWeekMonday(label, settings.timeZone);
  return Array.from({ length: 7 }, (_, i) => {
    const from = workweekStart(monday, settings, i);
    return { day: shopDayKey(from, settings.timeZone), from, to: workweekStart(monday, settings, i + 1) };
  });
}
