/** Clock times and durations as the shop floor reads them: "7:02", "0:38". */

const clockFormats = new Map<string, Intl.DateTimeFormat>();

function clockFormat(timeZone: string | undefined): Intl.DateTimeFormat {
  const key = timeZone ?? '';
  let format = clockFormats.get(key);
  if (!format) {
    try {
      format = new Intl.DateTimeFormat('en-US', {
        hour: 'numeric',
        minute: '2-digit',
        hour12: true,
        timeZone,
      });
    } catch {
      format = new Intl.DateTimeFormat('en-US', { hour: 'numeric', minute: '2-digit', hour12: true });
    }
    clockFormats.set(key, format);
  }
  return format;
}

/** "7:02" — hour and minute, 12-hour, without the day period. */
export function clockTime(at: string | number | Date, timeZone?: string): string {
  const parts = clockFormat(timeZone).formatToParts(new Date(at));
  const hour = parts.find((p) => p.type === 'hour')?.value ?? '';
  const minute = parts.find((p) => p.type === 'minute')?.value ?? '';
  return `${hour}:${minute}`;
}

/** "am" or "pm" for the header clock. */
export function dayPeriod(at: string | number | Date, timeZone?: string): string {
  const part = clockFormat(timeZone)
    .formatToParts(new Date(at))
    .find((p) => p.type === 'dayPeriod');
  return (part?.value ?? '').toLowerCase();
}

/** "Wed, Dec 2" in the shop's zone (the tablet's own when the zone is not a valid one). */
export function shortDate(at: string | number | Date, timeZone: string): string {
  const options: Intl.DateTimeFormatOptions = { weekday: 'short', month: 'short', day: 'numeric' };
  try {
    return new Intl.DateTimeFormat('en-US', { ...options, timeZone }).format(new Date(at));
  } catch {
    return new Intl.DateTimeFormat('en-US', options).format(new Date(at));
  }
}

/** "0:38", "12:05" — hours and minutes from seconds, rounded down. */
export function hoursMinutes(seconds: number): string {
  const total = Math.max(0, Math.floor(seconds / 60));
  return `${Math.floor(total / 60)}:${String(total % 60).padStart(2, '0')}`;
}

/** "1.5 h" */
export function bookHours(hours: number): string {
  return `${Number(hours.toFixed(2))} h`;
}

/** "4:05" or "1:02:03": a countdown, rounded up so it reads 0:00 only when time is up. */
export function countdown(seconds: number): string {
  const total = Math.max(0, Math.ceil(seconds));
  const h = Math.floor(total / 3600);
  const m = Math.floor((total % 3600) / 60);
  const s = String(total % 60).padStart(2, '0');
  return h > 0 ? `${h}:${String(m).padStart(2, '0')}:${s}` : `${m}:${s}`;
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
