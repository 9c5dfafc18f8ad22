/** Formatting for the board: short, fixed shapes that read from across the shop. */
import { clockTime } from '@/lib/shop-clock';

function pad2(n: number): string {
  return String(n).padStart(2, '0');
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

/**
 * Room for any span under 100 days: the board's digits are all one width ("tabular-nums" in
 * wall.module.css), and "23h 59m" outgrows "<1m", "59m" and "99d 23h". What sits beside a ticking span
 * keeps this much room, so it holds still as the span grows.
 */
export const WIDEST_SPAN = '00h 00m';

/** Room for any span under an hour: "00m" is as wide as "59m" and a hair wider than "<1m" (chromium). */
const WIDEST_MINUTES = '00m';

/**
 * The room a span needs until it next changes shape: minutes alone for the first hour, then any span.
 * A chip packed by it repacks once when its span turns an hour, instead of keeping the room of "23h 59m"
 * from its first minute (114 px more on a 1080p wall's strip chip).
 */
export function widestSpanUntilHour(seconds: number): string {
  return seconds < 3600 ? WIDEST_MINUTES : WIDEST_SPAN;
}

/** A time of day in the shop's zone, "9:40 am" or "09:40" as the shop reads clocks. */
export function formatTimeOfDay(ms: number, timeZone: string | undefined): string {
  return clockTime(ms, timeZone);
}
