import { useSyncExternalStore } from 'react';
import { watchToken } from '@/lib/api-client';
import { device } from '@/lib/device';
import { session } from '@/lib/session';

function subscribe(listener: () => void) {
  const offSession = session.subscribe(listener);
  const offDevice = device.subscribe(listener);
  return () => {
    offSession();
    offDevice();
  };
}

/** The token the kiosk watches the floor with: the signed-in one, else the tablet's own. */
export function useWatchToken(): string | null {
  return useSyncExternalStore(subscribe, watchToken);
}
