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
