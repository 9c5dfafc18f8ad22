import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BayDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { dispatchQueryOptions } from './get-dispatch';

/** The road test or final look is done: a bay in check goes to ready. */
export function recordFinalCheck(bayId: number): Promise<BayDto> {
  return officeApi.post<BayDto>(`/bays/${bayId}/final-check`, {});
}

export function useRecordFinalCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordFinalCheck,
    onSettled: () => queryClient.invalidateQueries({ queryKey: dispatchQueryOptions().queryKey }),
  });
}
