import { TZDate } from '@date-fns/tz';
import type { OpeningHours } from '../shop/shop.schema.js';

const MS_PER_HOUR = 3_600_000;

export interface QueuedLine {
  id: number;
  /** Book hours not yet flagged on the line. */
  remainingBookHours: number;
  promisedAt?: Date | string | null;
}

export interface QueueForecastInput {
  /** One technician's lines, in queue order. */
  lines: readonly QueuedLine[];
  /** Flagged ÷ clocked hours over the last four weeks; null (a new tech) counts as 1.0. */
  efficiency: number | null;
  openingHours: OpeningHours;
  /** The shop's IANA time zone: opening hours are wall-clock times there. */
  timeZone: string;
  now: Date;
}

export interface LineForecast {
  id: number;
  /** Open hours the line should take: remaining book hours ÷ efficiency. */
  workHours: number;
  startAt: Date;
  finishAt: Date;
  /** Finishes after the time promised to the customer. */
  late: boolean;
}

function wallClock(day: TZDate, hhmm: string, timeZone: string): number {
  const [hours = 0, minutes = 0] = hhmm.split(':').map(Number);
  return new TZDate(day.getFullYear(), day.getMonth(), day.getDate(), hours, minutes, timeZone).getTime();
}

/**
 * The open period containing `at`, or the next one, as epoch ms. Built from wall-clock times in the
 * shop's zone each day, so a DST day's open hours are as long as they really are. A day whose close is
 * not after its open counts as closed (overnight hours are not supported).
 */
function openPeriodFrom(at: number, openingHours: OpeningHours, timeZone: string) {
  const local = new TZDate(at, timeZone);
  // The rest of today plus a full week meets every open weekday.
  for (let offset = 0; offset <= 7; offset++) {
    const day = new TZDate(local.getFullYear(), local.getMonth(), local.getDate() + offset, timeZone);
    const hours = openingHours[day.getDay()];
    if (!hours) continue;
    const open = wallClock(day, hours.open, timeZone);
    const close = wallClock(day, hours.close, timeZone);
    if (close > open && close > at) return { start: Math.max(open, at), end: close };
  }
  throw new RangeError('The shop has no opening hours');
}

/** `start` plus `hours` of shop time: closed hours are skipped; work stops at a close and resumes at the next open. */
export function addOpenHours(start: Date, hours: number, openingHours: OpeningHours, timeZone: string): Date {
  let left = Math.max(0, Math.round(hours * MS_PER_HOUR));
  let period = openPeriodFrom(start.getTime(), openingHours, timeZone);
  // Ending exactly at a close stays on that day.
  while (left > period.end - period.start) {
    left -= period.end - period.start;
    period = openPeriodFrom(period.end, openingHours, timeZone);
  }
  return new Date(period.start + left);
}

/**
 * When each of a technician's queued lines should finish: one after another from now (or the next
 * opening), each taking its remaining book hours ÷ the tech's recent efficiency in open shop hours.
 * Throws a RangeError when the shop has no open day.
 */
export function forecastTechnicianQueue(input: QueueForecastInput): LineForecast[] {
  const { efficiency, openingHours, timeZone } = input;
  const rate = efficiency !== null && Number.isFinite(efficiency) && efficiency > 0 ? efficiency : 1;
  let cursor = input.now;
  return input.lines.map((line) => {
    const workHours = Math.max(0, line.remainingBookHours) / rate;
    const startAt = new Date(openPeriodFrom(cursor.getTime(), openingHours, timeZone).start);
    const finishAt = addOpenHours(startAt, workHours, openingHours, timeZone);
    cursor = finishAt;
    const promised = line.promisedAt == null ? null : new Date(line.promisedAt);
    return { id: line.id, workHours, startAt, finishAt, late: promised !== null && finishAt > promised };
  });
}
