const formats = new Map<string, Intl.DateTimeFormat>();

/** A cached `Intl.DateTimeFormat` for the shop's time zone (the browser's own when unknown or invalid). */
export function dateTimeFormat(
  timeZone: string | undefined,
  options: Intl.DateTimeFormatOptions,
): Intl.DateTimeFormat {
  const key = `${timeZone ?? ''}|${JSON.stringify(options)}`;
  let found = formats.get(key);
  if (!found) {
    try {
      found = new Intl.DateTimeFormat('en-US', { ...options, timeZone });
    } catch {
      found = new Intl.DateTimeFormat('en-US', options);
    }
    formats.set(key, found);
  }
  return found;
}

/** "Dec 2, 2026, 9:40 AM" in the shop's zone, or "—" for no time; `seconds` adds them (logs). */
export function shopDateTime(
  timeZone: string | undefined,
  seconds = false,
): (iso: string | null | undefined) => string {
  const format = dateTimeFormat(timeZone, { dateStyle: 'medium', timeStyle: seconds ? 'medium' : 'short' });
  return (iso) => (iso ? format.format(new Date(iso)) : '—');
}
