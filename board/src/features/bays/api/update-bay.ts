import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BayDto, UpdateBayBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { baysQueryOptions } from './get-bays';

export function updateBay({ id, ...body }: UpdateBayBody & { id: number }): Promise<BayDto> {
  return officeApi.patch<BayDto>(`/bays/${id}`, body);
}

export function useUpdateBay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateBay,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: baysQueryOptions().queryKey }),
  });
}
