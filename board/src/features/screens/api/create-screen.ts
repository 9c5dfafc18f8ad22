import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateScreenBody, ScreenPairing } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { DEVICE_ROUTES, screensQueryOptions, type DeviceKind } from './get-screens';

export function createScreen(body: CreateScreenBody, kind: DeviceKind = 'wall'): Promise<ScreenPairing> {
  return officeApi.post<ScreenPairing>(DEVICE_ROUTES[kind], body);
}

export function useCreateScreen(kind: DeviceKind = 'wall') {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (body: CreateScreenBody) => createScreen(body, kind),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: screensQueryOptions(kind).queryKey }),
  });
}
