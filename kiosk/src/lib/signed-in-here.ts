import { useSyncExternalStore } from 'react';

/**
 * Who signed in on this tablet lately, with their names: the timers of every one of them chime
 * here, whoever signed in last. Kept in localStorage, so a reload or a restarted browser still
 * knows; nothing in it opens anything.
 */
export const SIGNED_IN_HERE_KEY = 'baytime.kiosk.signed-in-here';

/** A long shift, and the timers still running when it ends. */
export const SIGNED_IN_KEEP_MS = 14 * 3600_000;

export interface SignedInHere {
  id: number;
  name: string;
  /** The last sign-in on this tablet, ms. */
  at: number;
}

/** The list with this sign-in last in it: one entry per technician, and none too old to be heard. */
export function withSignIn(
  list: readonly SignedInHere[],
  user: { id: number; name: string },
  at: number,
): SignedInHere[] {
  return [
    ...list.filter((entry) => entry.id !== user.id && at - entry.at < SIGNED_IN_KEEP_MS),
    { id: user.id, name: user.name, at },
  ];
}

/** Those who signed in here recently enough to be heard, by id, with their names. */
export function recentlySignedIn(list: readonly SignedInHere[], now: number): Map<number, string> {
  return new Map(
    list.filter((entry) => now - entry.at < SIGNED_IN_KEEP_MS).map((entry) => [entry.id, entry.name]),
  );
}

export function parseSignedInHere(text: string | null): SignedInHere[] {
  try {
    const parsed: unknown = JSON.parse(text ?? '[]');
    if (!Array.isArray(parsed)) return [];
    return parsed.filter(
      (entry): entry is SignedInHere =>
        typeof entry === 'object' &&
        entry !== null &&
        typeof (entry as SignedInHere).id === 'number' &&
        typeof (entry as SignedInHere).name === 'string' &&
        typeof (entry as SignedInHere).at === 'number',
    );
  } catch {
    return [];
  }
}

function read(): SignedInHere[] {
  try {
    return parseSignedInHere(localStorage.getItem(SIGNED_IN_HERE_KEY));
  } catch {
    return [];
  }
}

let list: readonly SignedInHere[] = read();
const listeners = new Set<() => void>();

export const signedInHere = {
  get: (): readonly SignedInHere[] => list,
  add(user: { id: number; name: string }, at: number) {
    const next = withSignIn(list, user, at);
    if (sameList(next, list)) return;
    list = next;
    try {
      localStorage.setItem(SIGNED_IN_HERE_KEY, JSON.stringify(list));
    } catch {
      // private mode: kept in memory only
    }
    for (const listener of listeners) listener();
  },
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => void listeners.delete(listener);
  },
};

const sameList = (a: readonly SignedInHere[], b: readonly SignedInHere[]) =>
  a.length === b.length &&
  a.every((entry, i) => entry.id === b[i]?.id && entry.name === b[i]?.name && entry.at === b[i]?.at);

export function useSignedInHere(): readonly SignedInHere[] {
  return useSyncExternalStore(signedInHere.subscribe, signedInHere.get);
}
