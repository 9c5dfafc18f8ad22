import { PARTS_STATE_WORDS, shopDayKey, type PartsHoldDto } from '@baytime/shared';
import { dateTimeFormat } from '@/lib/date-format';
import { clockTime } from '@/lib/shop-clock';

/** "Tue 2:30 pm" in the shop's zone; with the date when it is not this week. */
export function formatArrival(iso: string, nowMs: number, timeZone: string | undefined): string {
  const at = new Date(iso);
  const near = Math.abs(at.getTime() - nowMs) < 6 * 24 * 3600_000;
  const day = near
    ? dateTimeFormat(timeZone, { weekday: 'short' })
    : dateTimeFormat(timeZone, { month: 'short', day: 'numeric' });
  return `${day.format(at)}${near ? '' : ','} ${clockTime(at, timeZone)}`;
}

/**
 * One line on what a held line waits for: "Tie rod end · Back-ordered · Kestrel Parts · due Tue
 * 2:30 PM", or "late since …" once the arrival has passed.
 */
export function partsSummary(parts: PartsHoldDto, nowMs: number, timeZone: string | undefined): string {
  const words = [
    parts.part ?? 'Part not named yet',
    parts.state ? PARTS_STATE_WORDS[parts.state] : 'Not ordered yet',
  ];
  if (parts.supplier) words.push(parts.supplier);
  if (parts.expectedAt)
    words.push(
      `${Date.parse(parts.expectedAt) <= nowMs ? 'late since' : 'due'} ${formatArrival(parts.expectedAt, nowMs, timeZone)}`,
    );
  return words.join(' · ');
}

/** The date and time inputs' values ('YYYY-MM-DD', 'HH:MM') for an instant, in the shop's zone. */
export function arrivalInputs(iso: string | null, timeZone: string): { day: string; time: string } {
  if (!iso) return { day: '', time: '' };
  const parts = dateTimeFormat(timeZone, {
    hour: '2-digit',
    minute: '2-digit',
    hourCycle: 'h23',
  }).formatToParts(new Date(iso));
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? '00';
  return { day: shopDayKey(new Date(iso), timeZone), time: `${part('hour')}:${part('minute')}` };
}
