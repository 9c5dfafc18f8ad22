import {
  workweekBounds,
  workweekDays,
  workweekOf,
  type ShopDay,
  type WorkweekSettings,
} from '@baytime/shared';

/**
 * Where a test's past, reaching `reachMs` back, ends so that all of it lies in one shop week: now, or a
 * minute before this week began when it began less than `reachMs` ago (a test run just after midnight on
 * the week's first day would otherwise straddle two weeks).
 */
export function oneWeekEnd(reachMs: number, shop: WorkweekSettings): number {
  const now = Date.now();
  const weekFrom = workweekBounds(workweekOf(new Date(now), shop), shop).from.getTime();
  return now - weekFrom < reachMs ? weekFrom - 60_000 : now;
}

/** The weekdays (Monday to Friday) of a shop week. */
export function weekdaysOf(week: string, shop: WorkweekSettings): ShopDay[] {
  return workweekDays(week, shop).filter(
    (day) => ![0, 6].includes(new Date(`${day.day}T12:00:00Z`).getUTCDay()),
  );
}
