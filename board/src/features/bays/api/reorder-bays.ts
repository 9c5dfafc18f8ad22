import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BayDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { baysQueryOptions } from './get-bays';

/** `PUT /api/bays/order`: every bay in use, in the order the wall shows them. */
export function reorderBays(bayIds: number[]): Promise<BayDto[]> {
  return officeApi.put<BayDto[]>('/bays/order', { bayIds });
}

export function useReorderBays() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reorderBays,
    onSuccess: (bays) => queryClient.setQueryData(baysQueryOptions().queryKey, bays),
  });
}
