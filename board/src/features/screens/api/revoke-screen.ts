import { useMutation, useQueryClient } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';
import { DEVICE_ROUTES, screensQueryOptions, type DeviceKind, type WallScreenDto } from './get-screens';

/** Revokes a wall screen or kiosk: its token stops working and its pairing code too. */
export function revokeScreen(id: number, kind: DeviceKind = 'wall'): Promise<WallScreenDto> {
  return officeApi.delete<WallScreenDto>(`${DEVICE_ROUTES[kind]}/${id}`);
}

export function useRevokeScreen(kind: DeviceKind = 'wall') {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: (id: number) => revokeScreen(id, kind),
    onSuccess: () => queryClient.invalidateQueries({ queryKey: screensQueryOptions(kind).queryKey }),
  });
}
