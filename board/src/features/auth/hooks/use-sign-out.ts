import { useCallback } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { officeToken } from '@/lib/token-store';
import { officeSignIn } from '../office-sign-in';

export function useSignOut(): () => void {
  const queryClient = useQueryClient();
  return useCallback(() => {
    officeToken.clear();
    officeSignIn.clear();
    queryClient.clear();
  }, [queryClient]);
}
