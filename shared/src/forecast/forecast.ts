import { TZDate } from '@date-fns/tz';
import type { OpeningHours } from '../shop/shop.schema.js';

const MS_PER_HOUR = 3_600_000;
const DAYS_PER_WEEK = 7;
const SIX_DAYS_MS = 6 * 24 * MS_PER_HOUR;
/**
 * A technician's recent efficiency counts within these bounds: one odd week must not send a forecast
 * to the next month (or to the next minute).
 */
export const FORECAST_EFFICIENCY_BOUNDS = { min: 0.25, max: 4 } as const;

export interface QueuedLine {
  id: number;
  /** Book hours not yet flagged on the line. */
  remainingBookHours: number;
  promisedAt?: Date | string | null;
  /** The line cannot start before this (parts due then); null or absent: it can start now. */
  notBefore?: Date | string | null;
}

export interface QueueForecastInput {
  /** One technician's lines, in queue order. */
  lines: readonly QueuedLine[];
  /** Flagged ÷ clocked hours recently; null (not enough history) counts as 1.0. */
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

interface OpenPeriod {
  start: number;
  end: number;
}

function wallClock(year: number, month: number, date: number, hhmm: string, timeZone: string): number {
  const [hours = 0, minutes = 0] = hhmm.split(':').map(Number);
  return new TZDate(year, month, date, hours, minutes, timeZone).getTime();
}

const KEPT_OPEN_PERIODS = 256;
const keptOpenPeriods = new Map<string, readonly OpenPeriod[]>();

/**
 * The open periods of the local days around `year-month-date` (the day before to eight days after), as
 * instants. Built from wall-clock times in the shop's zone each day, so a DST day's open hours are as
 * long as they really are. A close at or before the open runs overnight into the next day (22:00–06:00);
 * an open equal to the close is open round the clock. The same for every instant of that local day, so
 * they are kept: a queue's forecasts ask for them again and again, and each wall-clock time costs a
 * look-up of the zone's offset.
 */
function openPeriodsAround(
  year: number,
  month: number,
  date: number,
  openingHours: OpeningHours,
  timeZone: string,
): readonly OpenPeriod[] {
  const key = `${timeZone} ${year}-${month}-${date} ${JSON.stringify(openingHours)}`;
  const kept = keptOpenPeriods.get(key);
  if (kept) return kept;
  const periods: OpenPeriod[] = [];
  for (let offset = -1; offset <= DAYS_PER_WEEK + 1; offset++) {
    const weekday = new TZDate(year, month, date + offset, timeZone).getDay();
    const hours = openingHours[weekday];
    if (!hours) continue;
    const overnight = hours.close <= hours.open;
    const open = wallClock(year, month, date + offset, hours.open, timeZone);
    const close = wallClock(year, month, date + offset + (overnight ? 1 : 0), hours.close, timeZone);
    if (close > open) periods.push({ start: open, end: close });
  }
  if (keptOpenPeriods.size >= KEPT_OPEN_PERIODS) keptOpenPeriods.delete(keptOpenPeriods.keys().next().value!);
  keptOpenPeriods.set(key, periods);
  return periods;
}

interface LocalDay {
  timeZone: string;
  year: number;
  month: number;
  date: number;
  /** Its first instant and the next day's. */
  start: number;
  end: number;
}

const KEPT_LOCAL_DAYS = 64;
const keptLocalDays: LocalDay[] = [];

/**
 * The local calendar day that holds the instant `at`. Kept with its bounds, so the many instants of a
 * queue's forecasts that fall on the same few days cost no look-up of the zone's offset.
 */
function localDay(at: number, timeZone: string): LocalDay {
  const kept = keptLocalDays.find((day) => day.timeZone === timeZone && at >= day.start && at < day.end);
  if (kept) return kept;
  const local = new TZDate(at, timeZone);
  const [year, month, date] = [local.getFullYear(), local.getMonth(), local.getDate()];
  const day = {
    timeZone,
    year,
    month,
    date,
    start: new TZDate(year, month, date, timeZone).getTime(),
    end: new TZDate(year, month, date + 1, timeZone).getTime(),
  };
  // Kept only when the bounds hold the instant: a zone can skip a midnight.
  if (day.start <= at && at < day.end) {
    if (keptLocalDays.length >= KEPT_LOCAL_DAYS) keptLocalDays.shift();
    keptLocalDays.push(day);
  }
  return day;
}

/**
 * The shop's open periods from `from` over the next week and a day, merged where they touch, the
 * first clipped to start at `from`.
 */
function openPeriodsFrom(from: number, openingHours: OpeningHours, timeZone: string): OpenPeriod[] {
  const local = localDay(from, timeZone);
  const periods = openPeriodsAround(local.year, local.month, local.date, openingHours, timeZone)
    .filter((period) => period.end > from)
    .map((period) => ({ start: Math.max(period.start, from), end: period.end }))
    .sort((a, b) => a.start - b.start);
  const merged: OpenPeriod[] = [];
  for (const period of periods) {
    const last = merged.at(-1);
    if (last && period.start <= last.end) last.end = Math.max(last.end, period.end);
    else merged.push(period);
  }
  return merged;
}

function weeksLater(at: number, weeks: number, timeZone: string): number {
  const local = new TZDate(at, timeZone);
  local.setDate(local.getDate() + weeks * DAYS_PER_WEEK);
  return local.getTime();
}

/** The first open instant at or after `at`; null when the shop never opens. */
export function nextOpening(at: Date, openingHours: OpeningHours, timeZone: string): Date | null {
  const first = openPeriodsFrom(at.getTime(), openingHours, timeZone)[0];
  return first ? new Date(first.start) : null;
}

/**
 * `start` plus `hours` of shop time: closed hours are skipped; work stops at a close and resumes at
 * the next open. Whole weeks are skipped in one step, so the work does not grow with the hours.
 * Null when the shop has no opening hours.
 */
export function addOpenHours(
  start: Date,
  hours: number,
  openingHours: OpeningHours,
  timeZone: string,
): Date | null {
  // NaN hours would never run out below, and the loop would hold the server for good.
  if (!Number.isFinite(hours)) throw new RangeError(`Cannot add ${hours} open hours`);
  let left = Math.max(0, Math.round(hours * MS_PER_HOUR));
  let cursor = start.getTime();
  const ahead = openPeriodsFrom(cursor, openingHours, timeZone);
  const openUntil = (end: number) =>
    ahead.reduce((sum, p) => sum + Math.max(0, Math.min(p.end, end) - p.start), 0);
  // Six days of 24 hours lie within the local week from `cursor`, whatever a DST change does to it: work
  // that fits in their open hours skips no whole week, and the week's end need not be found.
  const sixDaysOpen = openUntil(cursor + SIX_DAYS_MS);
  if (sixDaysOpen === 0 || left > sixDaysOpen) {
    const weekOpen = openUntil(weeksLater(cursor, 1, timeZone));
    if (weekOpen === 0) return null;
    // Ending exactly at a close stays on that day: skip only the weeks that leave work over.
    const wholeWeeks = left > 0 ? Math.floor((left - 1) / weekOpen) : 0;
    if (wholeWeeks > 0) {
      cursor = weeksLater(cursor, wholeWeeks, timeZone);
      left -= wholeWeeks * weekOpen;
    }
  }
  // At most a week's work is left; a DST change inside skipped open hours can leave an hour more.
  for (;;) {
    const periods = openPeriodsFrom(cursor, openingHours, timeZone);
    for (const period of periods) {
      if (left <= period.end - period.start) return new Date(period.start + left);
      left -= period.end - period.start;
    }
    cursor = periods.at(-1)!.end;
  }
}

/**
 * When each of a technician's queued lines should finish: one after another from now (or the next
 * opening), each taking its remaining book hours ÷ the tech's recent efficiency in open shop hours.
 * A line with a `notBefore` waits for it: meanwhile the tech works the next line in queue order that
 * can start, and a line once started is finished before the next. When nothing can start, the tech
 * waits for the earliest `notBefore`. The forecasts come in the order the work is done. Null when the
 * shop has no opening hours: there is nothing to forecast against.
 */
export function forecastTechnicianQueue(input: QueueForecastInput): LineForecast[] | null {
  const { efficiency, openingHours, timeZone } = input;
  const { min, max } = FORECAST_EFFICIENCY_BOUNDS;
  const rate =
    efficiency !== null && Number.isFinite(efficiency) && efficiency > 0
      ? Math.min(max, Math.max(min, efficiency))
      : 1;
  const waiting = input.lines.map((line) => ({
    line,
    notBefore: line.notBefore == null ? -Infinity : new Date(line.notBefore).getTime(),
  }));
  let cursor = input.now;
  const forecasts: LineForecast[] = [];
  while (waiting.length > 0) {
    const opening = nextOpening(cursor, openingHours, timeZone);
    if (!opening) return null;
    const ready = waiting.findIndex((w) => w.notBefore <= opening.getTime());
    const index =
      ready !== -1
        ? ready
        : waiting.reduce((best, w, i) => (w.notBefore < waiting[best]!.notBefore ? i : best), 0);
    const [{ line, notBefore }] = waiting.splice(index, 1) as [(typeof waiting)[number]];
    const workHours = Math.max(0, line.remainingBookHours) / rate;
    const startAt = ready !== -1 ? opening : nextOpening(new Date(notBefore), openingHours, timeZone)!;
    const finishAt = addOpenHours(startAt, workHours, openingHours, timeZone);
    if (!finishAt) return null;
    cursor = finishAt;
    const promised = line.promisedAt == null ? null : new Date(line.promisedAt);
    forecasts.push({
      id: line.id,
      workHours,
      startAt,
      finishAt,
      late: promised !== null && finishAt > promised,
    });
  }
  return forecasts;
}
