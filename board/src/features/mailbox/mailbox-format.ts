import { clockTime } from '@/lib/shop-clock';
/** Bytes in the units a person reads: "812 B", "14 KB", "2.3 MB". */
export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${Math.round(bytes / 1024)} KB`;
  return `${(bytes / (1024 * 1024)).toFixed(1)} MB`;
}

/** "ada@example.test", or "ada@example.test and 2 more" for a list. */
export function recipientsText(to: readonly string[]): string {
  if (to.length === 0) return '(no recipient)';
  if (to.length === 1) return to[0]!;
  return `${to[0]} and ${to.length - 1} more`;
}

/** The address from a From header: `"Shop" <a@b.test>` → name and address apart. */
export function splitAddress(from: string): { name: string | null; address: string } {
  const match = /^\s*"?([^"<]*?)"?\s*<([^>]+)>\s*$/.exec(from);
  if (!match) return { name: null, address: from.trim() };
  const name = match[1]!.trim();
  return { name: name || null, address: match[2]!.trim() };
}

/** When a message arrived: the time today, the day and time this week, the date otherwise. */
export function receivedText(iso: string, now: Date, timeZone?: string): string {
  const date = new Date(iso);
  const day = (d: Date) => new Intl.DateTimeFormat('en-CA', { timeZone }).format(d);
  const ageDays = (now.getTime() - date.getTime()) / 86_400_000;
  if (day(date) === day(now)) return clockTime(date, timeZone);
  if (ageDays < 6)
    return `${new Intl.DateTimeFormat('en-US', { weekday: 'short', timeZone }).format(date)} ${clockTime(date, timeZone)}`;
  return new Intl.DateTimeFormat('en-US', {
    month: 'short',
    day: 'numeric',
    year: 'numeric',
    timeZone,
  }).format(date);
}
