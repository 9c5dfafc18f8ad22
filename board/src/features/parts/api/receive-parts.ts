import { useMutation } from '@tanstack/react-query';
import type { JobLineDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { useRefreshPartsViews } from './parts-views';

/** `POST /api/job-lines/:id/parts/received`: the line goes back to its technician's queue. */
export const receiveParts = (jobLineId: number) =>
  officeApi.post<JobLineDto>(`/job-lines/${jobLineId}/parts/received`);

export function useReceiveParts(jobLineId: number) {
  const refresh = useRefreshPartsViews();
  return useMutation({ mutationFn: () => receiveParts(jobLineId), onSuccess: refresh });
}
