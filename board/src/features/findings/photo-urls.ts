/**
 * Object URLs for photo blobs, shared by everything showing the same blob and freed a moment after the
 * last one lets go (the moment lets a remount, as React's strict mode does, keep the same URL).
 */
interface Entry {
  url: string;
  users: number;
  timer: ReturnType<typeof setTimeout> | null;
}

export interface ObjectUrlApi {
  create: (blob: Blob) => string;
  revoke: (url: string) => void;
}

export function createPhotoUrls(api: ObjectUrlApi, graceMs = 1_000) {
  const entries = new Map<Blob, Entry>();

  const entryOf = (blob: Blob): Entry => {
    let entry = entries.get(blob);
    if (!entry) {
      entry = { url: api.create(blob), users: 0, timer: null };
      entries.set(blob, entry);
    }
    return entry;
  };

  return {
    /** The blob's URL, made on first use; safe to call while rendering. */
    urlFor: (blob: Blob): string => entryOf(blob).url,
    retain(blob: Blob): void {
      const entry = entryOf(blob);
      entry.users += 1;
      if (entry.timer) clearTimeout(entry.timer);
      entry.timer = null;
    },
    release(blob: Blob): void {
      const entry = entries.get(blob);
      if (!entry) return;
      entry.users = Math.max(0, entry.users - 1);
      if (entry.users > 0 || entry.timer) return;
      entry.timer = setTimeout(() => {
        if (entry.users > 0) return;
        entries.delete(blob);
        api.revoke(entry.url);
      }, graceMs);
    },
    size: () => entries.size,
  };
}

export const photoUrls = createPhotoUrls({
  create: (blob) => URL.createObjectURL(blob),
  revoke: (url) => URL.revokeObjectURL(url),
});
