import type { ClockFormat } from '../shop/shop.schema.js';

/**
 * The shapes time takes on every screen: labour in decimal hours ("1.2 h", how book hours are written
 * in the trade), countdowns in minutes and seconds ("4:05"), clock times as the shop chose them
 * ("2:30 pm" or "14:30").
 */

/**
 * Decimal hours to the hundredth, one trailing zero dropped: "1.2", "8.08", "3.0"; to the tenth where
 * room is short (the wall's tiles): "1.9".
 */
export function hoursFigure(hours: number, digits: 1 | 2 = 2): string {
  const fixed = Math.max(0, hours).toFixed(digits);
  return digits === 2 && fixed.endsWith('0') ? fixed.slice(0, -1) : fixed;
}

/** Labour, from hours: "1.5 h", the unit kept on the figure's line. */
export function formatBookHours(hours: number): string {
  return `${hoursFigure(hours)}\u00a0h`;
}

/** Labour, from seconds: 4,320 s is "1.2 h". */
export function formatHours(seconds: number): string {
  return formatBookHours(seconds / 3600);
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

/** How long something has waited, to the whole minute: "just now", "12 min", "2 h 5 min", "3 days 4 h". */
export function waitWords(sinceMs: number, nowMs: number): string {
  const minutes = Math.max(0, Math.floor((nowMs - sinceMs) / 60_000));
  if (minutes < 1) return 'just now';
  const days = Math.floor(minutes / (24 * 60));
  if (days === 0) return durationWords(minutes * 60);
  const hours = Math.floor((minutes % (24 * 60)) / 60);
  return `${days} ${days === 1 ? 'day' : 'days'}${hours ? ` ${hours} h` : ''}`;
}

/** A countdown, rounded up so it reads 0:00 only when time is up: "4:05", or "1:04:05" from an hour up. */
export function formatCountdown(seconds: number): string {
  const total = Math.max(0, Math.ceil(seconds));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = String(total % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${s}` : `${m}:${s}`;
}

const formats = new Map<string, Intl.DateTimeFormat>();

function clockTimeFormat(timeZone: string | undefined, clockFormat: ClockFormat, withDay: boolean) {
  const key = `${timeZone ?? ''}|${clockFormat}|${withDay}`;
  let format = formats.get(key);
  if (!format) {
    const options: Intl.DateTimeFormatOptions = {
      ...(withDay && { weekday: 'short', month: 'short', day: 'numeric' }),
      hour: clockFormat === '24h' ? '2-digit' : 'numeric',
      minute: '2-digit',
      hourCycle: clockFormat === '24h' ? 'h23' : 'h12',
    };
    try {
      format = new Intl.DateTimeFormat('en-US', { ...options, timeZone });
    } catch {
      // An unknown zone name must not blank a screen: the device's own zone is the best guess left.
      format = new Intl.DateTimeFormat('en-US', options);
    }
    formats.set(key, format);
  }
  return format;
}

export interface ClockParts {
  /** "2:30" or "14:30". */
  time: string;
  /** "am" or "pm" on a 12-hour clock, empty on a 24-hour one. */
  period: string;
}

/** A clock time in parts, for a big clock that sets the period smaller. */
export function clockParts(
  instant: Date | string | number,
  timeZone: string | undefined,
  clockFormat: ClockFormat,
): ClockParts {
  const parts = clockTimeFormat(timeZone, clockFormat, false).formatToParts(new Date(instant));
  const part = (type: Intl.DateTimeFormatPartTypes) => parts.find((p) => p.type === type)?.value ?? '';
  return { time: `${part('hour')}:${part('minute')}`, period: part('dayPeriod').toLowerCase() };
}

/** A clock time in the shop's zone: "2:30 pm" or "14:30". */
export function formatClockTime(
  instant: Date | string | number,
  timeZone: string | undefined,
  clockFormat: ClockFormat,
): string {
  const { time, period } = clockParts(instant, timeZone, clockFormat);
  return period ? `${time} ${period}` : time;
}

/** Day and clock time in the shop's zone: "Sat, Dec 5, 9:30 am" or "Sat, Dec 5, 09:30". */
export function formatDayClockTime(
  instant: Date | string | number,
  timeZone: string | undefined,
  clockFormat: ClockFormat,
): string {
  const parts = clockTimeFormat(timeZone, clockFormat, true).formatToParts(new Date(instant));
  return parts
    .map((part) => (part.type === 'dayPeriod' ? part.value.toLowerCase() : part.value))
    .join('')
    .replace(/\s+/g, ' ');
}

/** "Sat, Dec 5, 9:30 am" in the shop's time zone: how messages to customers name a time. */
export function formatShopInstant(instant: Date, timeZone: string, clockFormat: ClockFormat = '12h'): string {
  return formatDayClockTime(instant, timeZone, clockFormat);
}
