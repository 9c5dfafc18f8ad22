import { useSyncExternalStore } from 'react';

/**
 * The most recent technician token, kept after sign-out so the kiosk still hears timers finish
 * while nobody is signed in. Any technician's token reads the whole shop's running timers; which of
 * them chime here is for `signed-in-here` to say, not whose token this is. It lives in
 * sessionStorage (this tab only) with its expiry; a refusal by the server or the expiry ends it.
 */
export const LISTEN_TOKEN_KEY = 'baytime.kiosk.listen';

/** Dropped a little before the server would refuse it, so a reconnect never tries a dead token. */
const EXPIRY_MARGIN_MS = 30_000;

interface Stored {
  token: string;
  expiresAt: number;
}

/** A JWT's payload, read without checking the signature (the server does that). */
function tokenClaims(token: string): { exp?: unknown } {
  const payload = token.split('.')[1];
  if (!payload) return {};
  try {
    const base64 = payload.replace(/-/g, '+').replace(/_/g, '/');
    const padded = base64 + '='.repeat((4 - (base64.length % 4)) % 4);
    return JSON.parse(atob(padded)) as { exp?: unknown };
  } catch {
    return {};
  }
}

/** The `exp` of a JWT in ms. */
export function tokenExpiresAt(token: string): number | null {
  const { exp } = tokenClaims(token);
  return typeof exp === 'number' ? exp * 1000 : null;
}

function read(): Stored | null {
  try {
    const parsed = JSON.parse(sessionStorage.getItem(LISTEN_TOKEN_KEY) ?? 'null') as Partial<Stored> | null;
    return typeof parsed?.token === 'string' && typeof parsed.expiresAt === 'number'
      ? { token: parsed.token, expiresAt: parsed.expiresAt }
      : null;
  } catch {
    return null;
  }
}

let stored: Stored | null = read();
let expiryTimer: ReturnType<typeof setTimeout> | undefined;
const listeners = new Set<() => void>();

function emit() {
  for (const listener of listeners) listener();
}

function valid(now = Date.now()): string | null {
  return stored && stored.expiresAt - EXPIRY_MARGIN_MS > now ? stored.token : null;
}

function scheduleExpiry() {
  clearTimeout(expiryTimer);
  if (!stored) return;
  // setTimeout overflows past about 24.8 days; kiosk tokens last hours.
  const wait = Math.min(2 ** 31 - 1, Math.max(0, stored.expiresAt - EXPIRY_MARGIN_MS - Date.now()));
  expiryTimer = setTimeout(() => listenToken.clear(), wait);
}

export const listenToken = {
  /** The token if it is still good for a while, else null. */
  get: (): string | null => valid(),
  set(token: string) {
    const expiresAt = tokenExpiresAt(token);
    if (expiresAt === null || stored?.token === token) return;
    stored = { token, expiresAt };
    try {
      sessionStorage.setItem(LISTEN_TOKEN_KEY, JSON.stringify(stored));
    } catch {
      // private mode: kept in memory only
    }
    scheduleExpiry();
    emit();
  },
  /** Forgets the token; with `onlyIf`, only when it is that one. */
  clear(onlyIf?: string) {
    if (!stored || (onlyIf !== undefined && stored.token !== onlyIf)) return;
    stored = null;
    clearTimeout(expiryTimer);
    try {
      sessionStorage.removeItem(LISTEN_TOKEN_KEY);
    } catch {
      // nothing stored
    }
    emit();
  },
  subscribe(listener: () => void) {
    listeners.add(listener);
    return () => void listeners.delete(listener);
  },
};

if (stored && !valid()) listenToken.clear();
else scheduleExpiry();

export function useListenToken(): string | null {
  return useSyncExternalStore(listenToken.subscribe, listenToken.get);
}
