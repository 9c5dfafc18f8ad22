import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { HoldLineBody, JobLineDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { myDayRootKey } from './get-my-day';

/** `POST /api/job-lines/:id/hold`: the server clocks everyone off the line itself. */
export const holdLine = ({ jobLineId, ...body }: HoldLineBody & { jobLineId: number }) =>
  sendCommand(() => api.post<JobLineDto>(`/job-lines/${jobLineId}/hold`, body));

export function useHoldLine() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: holdLine,
    retry: false,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: myDayRootKey }),
  });
}
