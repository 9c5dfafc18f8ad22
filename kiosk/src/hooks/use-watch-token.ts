import { useSyncExternalStore } from 'react';
import { watchToken } from '@/lib/api-client';
import { listenToken } from '@/lib/listen-token';
import { session } from '@/lib/session';

function subscribe(listener: () => void) {
  const offSession = session.subscribe(listener);
  const offListen = listenToken.subscribe(listener);
  return () => {
    offSession();
    offListen();
  };
}

/** The token the kiosk watches the floor with: the signed-in one, else the last still valid. */
export function useWatchToken(): string | null {
  return useSyncExternalStore(subscribe, watchToken);
}
