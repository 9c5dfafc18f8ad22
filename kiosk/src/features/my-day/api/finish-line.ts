import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { FinishLineBody, JobLineDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { myDayRootKey } from './get-my-day';

/**
 * `POST /api/job-lines/:id/done`: clocks everyone off, marks the line done with its cause and
 * correction, and moves the bay to final check or ready when it was the bay's last open line.
 */
export const finishLine = ({ jobLineId, body }: { jobLineId: number; body: FinishLineBody }) =>
  sendCommand(() => api.post<JobLineDto>(`/job-lines/${jobLineId}/done`, body));

export function useFinishLine() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: finishLine,
    retry: false,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: myDayRootKey }),
  });
}
