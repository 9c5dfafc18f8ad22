import { useSyncExternalStore } from 'react';
import { officeToken } from '@/lib/token-store';

export function useOfficeToken(): string | null {
  return useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
}
