import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { BayDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { myDayRootKey } from './get-my-day';

/** `POST /api/bays/:id/final-check`: the road test or last look is done; the bay goes to ready. */
export const recordFinalCheck = (bayId: number) =>
  sendCommand(() => api.post<BayDto>(`/bays/${bayId}/final-check`, {}));

export function useRecordFinalCheck() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: recordFinalCheck,
    retry: false,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: myDayRootKey }),
  });
}
