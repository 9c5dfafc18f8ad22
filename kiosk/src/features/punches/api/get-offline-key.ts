import { useQuery } from '@tanstack/react-query';
import type { OfflineKeyDto } from '@baytime/shared';
import { deviceApi } from '@/lib/device';

const KEY_STORE = 'baytime.kiosk.offline-key';

/** The server's public key as last fetched: what an offline punch is sealed to when the link is down. */
export function storedOfflineKey(): OfflineKeyDto | null {
  try {
    const parsed = JSON.parse(localStorage.getItem(KEY_STORE) ?? 'null') as OfflineKeyDto | null;
    return parsed && typeof parsed.keyId === 'string' && typeof parsed.publicKey === 'object' ? parsed : null;
  } catch {
    return null;
  }
}

/** `GET /api/kiosks/me/offline-key`, kept on the tablet for when the server is out of reach. */
export async function fetchOfflineKey(): Promise<OfflineKeyDto> {
  const key = await deviceApi.get<OfflineKeyDto>('/kiosks/me/offline-key');
  try {
    localStorage.setItem(KEY_STORE, JSON.stringify(key));
  } catch {
    // Without storage the key is fetched again next time; offline punches then wait for it.
  }
  return key;
}

/** Fetches the key while the tablet is paired and online, now and every hour. */
export function useOfflineKey(paired: boolean) {
  return useQuery({
    queryKey: ['offline-key'],
    queryFn: fetchOfflineKey,
    enabled: paired,
    staleTime: 3600_000,
    refetchInterval: 3600_000,
    retry: false,
  });
}
