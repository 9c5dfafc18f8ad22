/** "Sat, Dec 5, 9:30 AM" in the shop's time zone: how messages to customers name a time. */
export function formatShopInstant(instant: Date, timeZone: string): string {
  return new Intl.DateTimeFormat('en-US', {
    weekday: 'short',
    month: 'short',
    day: 'numeric',
    hour: 'numeric',
    minute: '2-digit',
    timeZone,
  }).format(instant);
}
