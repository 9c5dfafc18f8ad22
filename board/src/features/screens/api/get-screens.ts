import { queryOptions, useQuery } from '@tanstack/react-query';
import type { KioskDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** A paired device: a wall screen (`/api/screens`) or a kiosk tablet (`/api/kiosks`). */
export type DeviceKind = 'wall' | 'kiosk';

/** One row of `GET /api/screens` or `GET /api/kiosks`; a kiosk's also says what waits on it. */
export interface WallScreenDto {
  id: number;
  name: string;
  pairedAt: string | null;
  lastSeenAt: string | null;
  /** Set once revoked: the device's token no longer works. */
  revokedAt: string | null;
  /** When the unused pairing code stops working; null once paired or revoked. */
  pairingExpiresAt: string | null;
  queue?: KioskDto['queue'];
}

export const DEVICE_ROUTES: Record<DeviceKind, string> = { wall: '/screens', kiosk: '/kiosks' };

export function getScreens(kind: DeviceKind = 'wall'): Promise<WallScreenDto[]> {
  return officeApi.get<WallScreenDto[]>(DEVICE_ROUTES[kind]);
}

export const screensQueryOptions = (kind: DeviceKind = 'wall') =>
  queryOptions({ queryKey: [kind === 'wall' ? 'screens' : 'kiosks'], queryFn: () => getScreens(kind) });

export function useScreens(kind: DeviceKind = 'wall') {
  return useQuery({ ...screensQueryOptions(kind), refetchInterval: 15_000 });
}
