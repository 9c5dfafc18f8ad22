import { shopLocalInstant, type ShopDay, type ShopSettings } from '@baytime/shared';

/** The day's opening hours in the shop's time zone, cut at `now`; null when closed or not open yet. */
export function openWindow(
  day: ShopDay,
  settings: ShopSettings,
  now: Date,
): { from: number; to: number } | null {
  const weekday = new Date(`${day.day}T12:00:00Z`).getUTCDay();
  const hoursOpen = settings.openingHours[weekday];
  if (!hoursOpen) return null;
  const from = shopLocalInstant(day.day, hoursOpen.open, settings.timeZone).getTime();
  const to = Math.min(shopLocalInstant(day.day, hoursOpen.close, settings.timeZone).getTime(), now.getTime());
  return to > from ? { from, to } : null;
}

/** Opening hours of the week already past at `now`, and in all. */
export function openingProgress(
  days: readonly ShopDay[],
  settings: ShopSettings,
  now: Date,
): { elapsedMs: number; totalMs: number } {
  const far = new Date(8.64e15);
  let [elapsedMs, totalMs] = [0, 0];
  for (const day of days) {
    const all = openWindow(day, settings, far);
    const past = openWindow(day, settings, now);
    totalMs += all ? all.to - all.from : 0;
    elapsedMs += past ? past.to - past.from : 0;
  }
  return { elapsedMs, totalMs };
}
