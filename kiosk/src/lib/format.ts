/** Clock times and durations as the shop floor reads them: "7:02 am", "1.2 h", "4:05" left. */
export { clockFace, clockTime, localDay, sinceTime } from './shop-clock';
export { durationWords, formatBookHours, formatCountdown as countdown, formatHours } from '@baytime/shared';

/** "Wed, Dec 2" in the shop's zone (the tablet's own when the zone is not a valid one). */
export function shortDate(at: string | number | Date, timeZone: string): string {
  const options: Intl.DateTimeFormatOptions = { weekday: 'short', month: 'short', day: 'numeric' };
  try {
    return new Intl.DateTimeFormat('en-US', { ...options, timeZone }).format(new Date(at));
  } catch {
    return new Intl.DateTimeFormat('en-US', options).format(new Date(at));
  }
}
