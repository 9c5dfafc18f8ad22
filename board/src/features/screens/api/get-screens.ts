import { queryOptions, useQuery } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';

/** One row of `GET /api/screens` (no shared type for it yet). */
export interface WallScreenDto {
  id: number;
  name: string;
  pairedAt: string | null;
  lastSeenAt: string | null;
  /** Set once revoked: the screen's token no longer works. */
  revokedAt: string | null;
  /** When the unused pairing code stops working; null once paired or revoked. */
  pairingExpiresAt: string | null;
}

export function getScreens(): Promise<WallScreenDto[]> {
  return officeApi.get<WallScreenDto[]>('/screens');
}

export const screensQueryOptions = () => queryOptions({ queryKey: ['screens'], queryFn: getScreens });

export function useScreens() {
  return useQuery({ ...screensQueryOptions(), refetchInterval: 15_000 });
}
