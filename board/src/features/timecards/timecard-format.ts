import { PUNCH_WORDS, type PunchKind } from '@baytime/shared';
import { clockTime, dayClockTime } from '@/lib/shop-clock';

export { BREAK_KIND_PAY_WORDS as BREAK_WORDS, PUNCH_WORDS, formatHours } from '@baytime/shared';

const formats = new Map<string, Intl.DateTimeFormat>();
function cached(key: string, make: () => Intl.DateTimeFormat): Intl.DateTimeFormat {
  let format = formats.get(key);
  if (!format) {
    format = make();
    formats.set(key, format);
  }
  return format;
}

/** The time of day of an instant in the shop's time zone, "7:25 am". */
export function formatClock(iso: string | Date, timeZone: string): string {
  return clockTime(iso, timeZone);
}

/** Day and time in the shop's time zone, "Mon, Nov 30, 7:25 am". */
export function formatDayClock(iso: string | Date, timeZone: string): string {
  return dayClockTime(iso, timeZone);
}

/** A local calendar day 'YYYY-MM-DD' as "Mon, Nov 30" (no time zone shift: the date is already local). */
export function formatDay(day: string): string {
  const [year, month, date] = day.split('-').map(Number);
  return cached(
    'day',
    () =>
      new Intl.DateTimeFormat('en-US', { weekday: 'short', month: 'short', day: 'numeric', timeZone: 'UTC' }),
  ).format(new Date(Date.UTC(year!, month! - 1, date!)));
}

/** 'HH:MM' (24 h) of an instant in a time zone, for time inputs. */
export function clockValue(iso: string | Date, timeZone: string): string {
  const parts = cached(
    `hhmm:${timeZone}`,
    () =>
      new Intl.DateTimeFormat('en-US', { hour: '2-digit', minute: '2-digit', hourCycle: 'h23', timeZone }),
  ).formatToParts(new Date(iso));
  const part = (type: string) => parts.find((p) => p.type === type)?.value ?? '00';
  return `${part('hour')}:${part('minute')}`;
}

/** 'YYYY-MM-DD' of an instant in a time zone, for date inputs. */
export function dayValue(iso: string | Date, timeZone: string): string {
  return cached(
    `ymd:${timeZone}`,
    () => new Intl.DateTimeFormat('en-CA', { year: 'numeric', month: '2-digit', day: '2-digit', timeZone }),
  ).format(new Date(iso));
}

const AUDIT_ACTIONS: Record<string, string> = {
  correct: 'Replaced a punch',
  'add-missed': 'Added a missed punch',
  void: 'Took a punch out of the count',
  accept: 'Accepted a late punch',
  reject: 'Rejected a late punch',
  hold: 'Held a late punch for review',
};

/** One audit entry in words: what was done, and the punch and reason it recorded. */
export function auditText(
  entry: { action: string; detail: Record<string, unknown> | null },
  timeZone: string,
): { action: string; detail: string } {
  const action = AUDIT_ACTIONS[entry.action] ?? entry.action.replace(/-/g, ' ');
  const detail = entry.detail ?? {};
  const kind =
    typeof detail.kind === 'string' ? (PUNCH_WORDS[detail.kind as PunchKind] ?? detail.kind) : null;
  const at = typeof detail.at === 'string' && !Number.isNaN(Date.parse(detail.at)) ? detail.at : null;
  const reason = typeof detail.reason === 'string' ? detail.reason : null;
  const parts = [
    [kind, at && `at ${formatDayClock(at, timeZone)}`].filter(Boolean).join(' '),
    reason && `“${reason}”`,
  ].filter(Boolean);
  return { action, detail: parts.join(': ') };
}
