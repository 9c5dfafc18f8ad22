import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateScreenBody, ScreenPairing } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { screensQueryOptions } from './get-screens';

export function createScreen(body: CreateScreenBody): Promise<ScreenPairing> {
  return officeApi.post<ScreenPairing>('/screens', body);
}

export function useCreateScreen() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createScreen,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: screensQueryOptions().queryKey }),
  });
}
