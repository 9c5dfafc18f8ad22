import { useEffect, useState } from 'react';
import { useLinkState, type LinkState } from '@/lib/socket';
import { useHealth } from '../api/get-health';

function useBrowserOnline(): boolean {
  const [online, setOnline] = useState(() => navigator.onLine);
  useEffect(() => {
    const update = () => setOnline(navigator.onLine);
    window.addEventListener('online', update);
    window.addEventListener('offline', update);
    return () => {
      window.removeEventListener('online', update);
      window.removeEventListener('offline', update);
    };
  }, []);
  return online;
}

/**
 * Online when the live link is up, or (nobody signed in) when the server answers its health check.
 * The browser's own offline flag wins: it knows first when the Wi-Fi drops.
 */
export function useConnectionState(signedIn: boolean): LinkState {
  const link = useLinkState();
  const browserOnline = useBrowserOnline();
  const health = useHealth(!signedIn);
  if (!browserOnline) return 'offline';
  if (signedIn) return link;
  if (health.isSuccess && !health.isError) return 'online';
  if (health.isError) return 'offline';
  return 'connecting';
}
