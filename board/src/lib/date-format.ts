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
