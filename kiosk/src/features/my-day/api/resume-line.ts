import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { JobLineDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { queryKeys } from '@/lib/query-keys';

/** `POST /api/job-lines/:id/resume`: the line is back in the queue, ready to clock on. */
export const resumeLine = (jobLineId: number) =>
  sendCommand(() => api.post<JobLineDto>(`/job-lines/${jobLineId}/resume`));

export function useResumeLine() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: resumeLine,
    retry: false,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.myDay.all() }),
  });
}
