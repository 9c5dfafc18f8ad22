import { dateTimeFormat } from '@/lib/date-format';
import { clockTime } from '@/lib/shop-clock';
/** Short shapes for dispatch: times in the shop's zone and hours of labour. */

export { formatBookHours, formatHours } from '@baytime/shared';

/** A 4-week efficiency (flagged ÷ clocked) as "112 %"; "new" when there is no history yet. */
export function formatEfficiency(efficiency: number | null): string {
  return efficiency === null ? 'new' : `${Math.round(efficiency * 100)} %`;
}

function dayKey(ms: number, timeZone: string | undefined): string {
  return dateTimeFormat(timeZone, { year: 'numeric', month: '2-digit', day: '2-digit' }).format(new Date(ms));
}

/**
 * A moment as the shop's clock shows it: "4:30 pm" today, "Wed 8:00 am" within a week, "Dec 9 8:00 am"
 * later. `nowMs` decides what "today" is.
 */
export function formatShopTime(iso: string, nowMs: number, timeZone: string | undefined): string {
  const ms = Date.parse(iso);
  const time = clockTime(ms, timeZone);
  if (dayKey(ms, timeZone) === dayKey(nowMs, timeZone)) return time;
  const days = Math.abs(ms - nowMs) / 86_400_000;
  const day =
    days < 6
      ? dateTimeFormat(timeZone, { weekday: 'short' }).format(new Date(ms))
      : dateTimeFormat(timeZone, { month: 'short', day: 'numeric' }).format(new Date(ms));
  return `${day} ${time}`;
}
