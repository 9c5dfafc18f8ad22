import { useSyncExternalStore } from 'react';
import { createApiClient } from '@baytime/shared/client';

/**
 * This tablet's own token, from pairing it once in the office (Admin → Kiosks). It says which kiosk
 * this is, never who is at it: technicians still sign in with badge and PIN. Kept in localStorage:
 * a reload, a restart and an outage keep the tablet paired.
 */
export const DEVICE_KEY = 'baytime.kiosk.device';

type Listener = () => void;
const listeners = new Set<Listener>();

function read(): string | null {
  try {
    return localStorage.getItem(DEVICE_KEY);
  } catch {
    return null;
  }
}

let current = read();

export const device = {
  token: (): string | null => current,
  set(token: string) {
    current = token;
    try {
      localStorage.setItem(DEVICE_KEY, token);
    } catch {
      // A browser that refuses storage keeps the pairing until the tab closes.
    }
    listeners.forEach((listener) => listener());
  },
  /** The server no longer knows this tablet (revoked in the office): pair it again. */
  forget() {
    if (current === null) return;
    current = null;
    try {
      localStorage.removeItem(DEVICE_KEY);
    } catch {
      // nothing stored
    }
    listeners.forEach((listener) => listener());
  },
  subscribe(listener: Listener) {
    listeners.add(listener);
    return () => void listeners.delete(listener);
  },
};

export function useDeviceToken(): string | null {
  return useSyncExternalStore(device.subscribe, device.token);
}

/** The API as this kiosk (not as a technician): its offline key, queue reports, offline punches. */
export const deviceApi = createApiClient({ getToken: device.token, onUnauthorized: device.forget });
