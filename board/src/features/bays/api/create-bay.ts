import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BayDto, CreateBayBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { baysQueryOptions } from './get-bays';

export function createBay(body: CreateBayBody): Promise<BayDto> {
  return officeApi.post<BayDto>('/bays', body);
}

export function useCreateBay() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createBay,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: baysQueryOptions().queryKey }),
  });
}
