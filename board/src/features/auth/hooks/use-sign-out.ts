import { useCallback } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { officeToken } from '@/lib/token-store';

export function useSignOut(): () => void {
  const queryClient = useQueryClient();
  return useCallback(() => {
    officeToken.clear();
    queryClient.clear();
  }, [queryClient]);
}
