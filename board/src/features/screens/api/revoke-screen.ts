import { useMutation, useQueryClient } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';
import { screensQueryOptions, type WallScreenDto } from './get-screens';

/** Revokes a wall screen: its token stops working and its pairing code too. */
export function revokeScreen(id: number): Promise<WallScreenDto> {
  return officeApi.delete<WallScreenDto>(`/screens/${id}`);
}

export function useRevokeScreen() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeScreen,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: screensQueryOptions().queryKey }),
  });
}
