import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BayDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { dispatchQueryOptions } from '@/lib/api/get-dispatch';

/** The vehicle has left: the bay is free again. */
export function releaseBay(bayId: number): Promise<BayDto> {
  return officeApi.post<BayDto>(`/bays/${bayId}/release`);
}

export function useReleaseBay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: releaseBay,
    onSettled: () => queryClient.invalidateQueries({ queryKey: dispatchQueryOptions().queryKey }),
  });
}
