import {
  clockParts,
  formatClockTime,
  formatDayClockTime,
  type ClockFormat,
  type ClockParts,
} from '@baytime/shared';

/**
 * How the shop reads clock times ("2:30 pm" or "14:30"), as its settings last said: set where the
 * settings arrive, read by every clock time this app shows. Until then, am/pm.
 */
let shopClockFormat: ClockFormat = '12h';

export function setShopClockFormat(format: ClockFormat | undefined): void {
  if (format) shopClockFormat = format;
}

/** "2:30 pm" or "14:30" in the shop's time zone. */
export function clockTime(instant: Date | string | number, timeZone: string | undefined): string {
  return formatClockTime(instant, timeZone, shopClockFormat);
}

/** "Sat, Dec 5, 2:30 pm" or "Sat, Dec 5, 14:30" in the shop's time zone. */
export function dayClockTime(instant: Date | string | number, timeZone: string | undefined): string {
  return formatDayClockTime(instant, timeZone, shopClockFormat);
}

/** The time and the am/pm apart, for a big clock. */
export function clockFace(instant: Date | string | number, timeZone: string | undefined): ClockParts {
  return clockParts(instant, timeZone, shopClockFormat);
}

const dayKeyFormats = new Map<string, Intl.DateTimeFormat>();

/** 'YYYY-MM-DD' of an instant in a time zone (the tablet's own without one). */
export function localDay(at: string | number, timeZone: string | undefined): string {
  const key = timeZone ?? '';
  let format = dayKeyFormats.get(key);
  if (!format) {
    format = new Intl.DateTimeFormat('en-CA', {
      timeZone,
      year: 'numeric',
      month: '2-digit',
      day: '2-digit',
    });
    dayKeyFormats.set(key, format);
  }
  return format.format(new Date(at));
}

/** Since when, as the shop reads it: "7:02 am" today, "Fri, Nov 27, 7:30 am" on an earlier day. */
export function sinceTime(instant: string, now: number, timeZone: string | undefined): string {
  return localDay(instant, timeZone) === localDay(now, timeZone)
    ? clockTime(instant, timeZone)
    : dayClockTime(instant, timeZone);
}
