import { dateTimeFormat } from '@/lib/date-format';
/** Formatting for repair orders: dates in the shop's zone, labour, odometers. */

function pad2(n: number): string {
  return String(n).padStart(2, '0');
}

/** "Wed, Dec 2, 4:30 PM" in the shop's zone. */
export function formatDateTime(iso: string, timeZone: string | undefined): string {
  return dateTimeFormat(timeZone, {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
  }).format(new Date(iso));
}

/** Labour as hours and minutes, "1:05". */
export function formatHm(seconds: number): string {
  const minutes = Math.round(Math.abs(seconds) / 60);
  return `${Math.floor(minutes / 60)}:${pad2(minutes % 60)}`;
}

/** Book hours as written on the RO, "1.5 h". */
export function formatBookHours(hours: number): string {
  return `${Number(hours.toFixed(1))} h`;
}

/**
 * Clocked against book: "+0:12 over", "0:20 under", "on book" within a minute. A line still open is
 * not under book yet: it has "0:20 left".
 */
export function formatOverUnder(clockedSeconds: number, bookHours: number, finished = true): string {
  const difference = clockedSeconds - bookHours * 3600;
  if (Math.abs(difference) < 60) return 'on book';
  if (difference > 0) return `+${formatHm(difference)} over`;
  return finished ? `${formatHm(difference)} under` : `${formatHm(difference)} left`;
}

/** "150,273 mi" or "241,842 km" by the shop's units. */
export function formatOdometer(value: number, units: 'metric' | 'us' | undefined): string {
  return `${value.toLocaleString('en-US')} ${units === 'metric' ? 'km' : 'mi'}`;
}

/** A VIN in groups that are easy to read aloud: WMI, descriptor with check digit, year and plant, serial. */
export function groupVin(vin: string): string {
  return vin.length === 17
    ? `${vin.slice(0, 3)} ${vin.slice(3, 9)} ${vin.slice(9, 11)} ${vin.slice(11)}`
    : vin;
}
