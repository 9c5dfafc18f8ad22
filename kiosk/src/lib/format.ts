/** Clock times and durations as the shop floor reads them: "7:02 am", "1.2 h", "4:05" left. */
export { clockFace, clockTime } from './shop-clock';
export { formatBookHours, formatCountdown as countdown, formatHours } from '@baytime/shared';

/** "Wed, Dec 2" in the shop's zone (the tablet's own when the zone is not a valid one). */
export function shortDate(at: string | number | Date, timeZone: string): string {
  const options: Intl.DateTimeFormatOptions = { weekday: 'short', month: 'short', day: 'numeric' };
  try {
    return new Intl.DateTimeFormat('en-US', { ...options, timeZone }).format(new Date(at));
  } catch {
    return new Intl.DateTimeFormat('en-US', options).format(new Date(at));
  }
}

/** "45 s", "30 min", "1 h 30 min": a duration as words. */
export function durationWords(seconds: number): string {
  const total = Math.max(0, Math.round(seconds));
  if (total < 60) return `${total} s`;
  const minutes = Math.round(total / 60);
  const h = Math.floor(minutes / 60);
  const m = minutes % 60;
  if (h === 0) return `${m} min`;
  return m === 0 ? `${h} h` : `${h} h ${m} min`;
}
