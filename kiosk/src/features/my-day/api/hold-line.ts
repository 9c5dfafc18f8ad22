import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoldReason, JobLineDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { myDayRootKey } from './get-my-day';

/** `POST /api/job-lines/:id/hold`: the server clocks everyone off the line itself. */
export const holdLine = ({ jobLineId, reason }: { jobLineId: number; reason: HoldReason }) =>
  sendCommand(() => api.post<JobLineDto>(`/job-lines/${jobLineId}/hold`, { reason }));

export function useHoldLine() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: holdLine,
    retry: false,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: myDayRootKey }),
  });
}
