import {
  addIsoWeeks,
  parseIsoWeek,
  workweekBounds,
  workweekName,
  workweekOf,
  type WorkweekSettings,
} from '@baytime/shared';

/** A week label from an address bar, or null when it is not an ISO week that exists. */
export function readWeek(value: string | null): string | null {
  return value && parseIsoWeek(value) ? value : null;
}

export function currentWeek(settings: WorkweekSettings, now = new Date()): string {
  return workweekOf(now, settings);
}

export function shiftWeek(label: string, weeks: number): string {
  return addIsoWeeks(label, weeks);
}

/** True when `label` is later than `than` (labels sort as text: both are 'YYYY-Www'). */
export function isAfterWeek(label: string, than: string): boolean {
  return label > than;
}

function dayFormat(timeZone: string, withYear: boolean): Intl.DateTimeFormat {
  return new Intl.DateTimeFormat('en-US', {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    ...(withYear ? { year: 'numeric' } : {}),
    timeZone,
  });
}

/**
 * The shop workweek of a label as dates, e.g. "Sun, Nov 29 – Sat, Dec 5, 2026". The last day is the
 * one the week's final instant falls on.
 */
export function weekRangeText(label: string, settings: WorkweekSettings): string {
  const { from, to } = workweekBounds(label, settings);
  const last = new Date(to.getTime() - 1);
  return `${dayFormat(settings.timeZone, false).format(from)} – ${dayFormat(settings.timeZone, true).format(last)}`;
}

/**
 * "Week of Sun, Nov 29": the shop workweek by its first day. The ISO-style label only says in which ISO week
 * the shop's week starts, which misleads when the shop's week starts on a Sunday.
 */
export function weekName(label: string, settings: WorkweekSettings): string {
  return workweekName(label, settings);
}
