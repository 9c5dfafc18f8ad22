import { atStart, formatHours, lineWords } from '@baytime/shared';
import { dayClockTime } from '@/lib/shop-clock';
/** Formatting for repair orders: dates in the shop's zone, labour, odometers. */

/** "Wed, Dec 2, 4:30 pm" in the shop's zone, as the shop reads clocks. */
export function formatDateTime(iso: string, timeZone: string | undefined): string {
  return dayClockTime(iso, timeZone);
}

export { formatBookHours, formatHours } from '@baytime/shared';

/**
 * Clocked against book: "+0.2 h over", "0.33 h under", "on book" within a minute. A line still open is
 * not under book yet: it has "0.33 h left".
 */
export function formatOverUnder(clockedSeconds: number, bookHours: number, finished = true): string {
  const difference = clockedSeconds - bookHours * 3600;
  if (Math.abs(difference) < 60) return 'on book';
  const hours = formatHours(Math.abs(difference));
  if (difference > 0) return `+${hours} over`;
  return finished ? `${hours} under` : `${hours} left`;
}

/** "150,273 mi" or "241,842 km" by the shop's units. */
export function formatOdometer(value: number, units: 'metric' | 'us' | undefined): string {
  return `${value.toLocaleString('en-US')} ${units === 'metric' ? 'km' : 'mi'}`;
}

/** A line as its label begins: "Line 2 · Replace brake pads". */
export function lineLabel(line: { lineNo: number; title: string }): string {
  return `${atStart(lineWords(line.lineNo))} · ${line.title}`;
}

/** A VIN in groups that are easy to read aloud: WMI, descriptor with check digit, year and plant, serial. */
export function groupVin(vin: string): string {
  return vin.length === 17
    ? `${vin.slice(0, 3)} ${vin.slice(3, 9)} ${vin.slice(9, 11)} ${vin.slice(11)}`
    : vin;
}
