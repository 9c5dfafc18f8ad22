import { useSyncExternalStore } from 'react';
import type { AuthUser } from '@baytime/shared';

/** The signed-in technician. Held in memory and sessionStorage only: the tablet is shared. */
export interface Session {
  accessToken: string;
  user: AuthUser;
  signedInAt: number;
}

export type SignOutReason = 'tapped' | 'idle' | 'expired';

export const SESSION_KEY = 'baytime.kiosk.session';

type Listener = () => void;

function readStored(): Session | null {
  try {
    const raw = sessionStorage.getItem(SESSION_KEY);
    if (!raw) return null;
    const parsed = JSON.parse(raw) as Partial<Session>;
    if (typeof parsed.accessToken !== 'string' || typeof parsed.user?.id !== 'number') return null;
    return parsed as Session;
  } catch {
    return null;
  }
}

let current: Session | null = readStored();
let lastSignOut: SignOutReason | null = null;
const listeners = new Set<Listener>();

function emit() {
  for (const listener of listeners) listener();
}

export const session = {
  get: (): Session | null => current,
  lastSignOutReason: (): SignOutReason | null => lastSignOut,
  set(accessToken: string, user: AuthUser) {
    current = { accessToken, user, signedInAt: Date.now() };
    lastSignOut = null;
    try {
      sessionStorage.setItem(SESSION_KEY, JSON.stringify(current));
    } catch {
      // A private-mode browser may refuse: the session then lives in memory only.
    }
    emit();
  },
  clear(reason: SignOutReason) {
    if (!current) return;
    current = null;
    lastSignOut = reason;
    try {
      sessionStorage.removeItem(SESSION_KEY);
    } catch {
      // nothing stored
    }
    emit();
  },
  forgetSignOutReason() {
    if (lastSignOut === null) return;
    lastSignOut = null;
    emit();
  },
  subscribe(listener: Listener) {
    listeners.add(listener);
    return () => void listeners.delete(listener);
  },
};

export function useSession(): Session | null {
  return useSyncExternalStore(session.subscribe, session.get);
}

export function useSignOutReason(): SignOutReason | null {
  return useSyncExternalStore(session.subscribe, session.lastSignOutReason);
}
