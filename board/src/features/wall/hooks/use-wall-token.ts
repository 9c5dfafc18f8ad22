import { useSyncExternalStore } from 'react';
import { wallToken } from '@/lib/token-store';

export function useWallToken(): string | null {
  return useSyncExternalStore(wallToken.subscribe, wallToken.get, wallToken.get);
}
