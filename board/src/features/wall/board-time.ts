/** Formatting for the board: short, fixed shapes that read from across the shop. */

function pad2(n: number): string {
  return String(n).padStart(2, '0');
}

/** Hours and minutes of labour, "1:05" (book and clocked time). */
export function formatHoursMinutes(seconds: number): string {
  const minutes = Math.floor(Math.max(0, seconds) / 60);
  return `${Math.floor(minutes / 60)}:${pad2(minutes % 60)}`;
}

/** A countdown with seconds: "4:05", or "1:04:05" from an hour up. */
export function formatCountdown(seconds: number): string {
  const s = Math.max(0, Math.ceil(seconds));
  const h = Math.floor(s / 3600);
  const m = Math.floor((s % 3600) / 60);
  return h > 0 ? `${h}:${pad2(m)}:${pad2(s % 60)}` : `${m}:${pad2(s % 60)}`;
}

/** How long something has lasted, in words short enough for a tile: "<1m", "42m", "1h 05m", "2d 3h". */
export function formatSpan(seconds: number): string {
  const minutes = Math.floor(Math.max(0, seconds) / 60);
  if (minutes < 1) return '<1m';
  if (minutes < 60) return `${minutes}m`;
  const hours = Math.floor(minutes / 60);
  if (hours < 24) return `${hours}h ${pad2(minutes % 60)}m`;
  return `${Math.floor(hours / 24)}d ${hours % 24}h`;
}

export interface ClockFace {
  time: string;
  /** "AM"/"PM" in a 12-hour locale, empty in a 24-hour one. */
  period: string;
}

const clockFormats = new Map<string, Intl.DateTimeFormat>();

function clockFormat(timeZone: string | undefined, locale: string | undefined): Intl.DateTimeFormat {
  const key = `${locale ?? ''}|${timeZone ?? ''}`;
  let format = clockFormats.get(key);
  if (!format) {
    try {
      format = new Intl.DateTimeFormat(locale, { hour: 'numeric', minute: '2-digit', timeZone });
    } catch {
      // An unknown zone name must not blank the board: fall back to the screen's own zone.
      format = new Intl.DateTimeFormat(locale, { hour: 'numeric', minute: '2-digit' });
    }
    clockFormats.set(key, format);
  }
  return format;
}

/** The wall clock in the shop's time zone. */
export function clockFace(ms: number, timeZone: string | undefined, locale?: string): ClockFace {
  const parts = clockFormat(timeZone, locale).formatToParts(new Date(ms));
  const period = parts.find((part) => part.type === 'dayPeriod')?.value ?? '';
  const time = parts
    .filter((part) => part.type !== 'dayPeriod')
    .map((part) => part.value)
    .join('')
    .trim();
  return { time, period };
}

/** A time of day in the shop's zone, "9:40 AM". */
export function formatTimeOfDay(ms: number, timeZone: string | undefined, locale?: string): string {
  const { time, period } = clockFace(ms, timeZone, locale);
  return period ? `${time} ${period}` : time;
}
