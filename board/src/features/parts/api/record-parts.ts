import { useMutation } from '@tanstack/react-query';
import type { PartsDetailsBody, PartsHoldDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { useRefreshPartsViews } from './parts-views';

/** `PUT /api/job-lines/:id/parts`: what the line waits for, its state, supplier and arrival. */
export const recordParts = (jobLineId: number, body: PartsDetailsBody) =>
  officeApi.put<PartsHoldDto>(`/job-lines/${jobLineId}/parts`, body);

export function useRecordParts(jobLineId: number) {
  const refresh = useRefreshPartsViews();
  return useMutation({
    mutationFn: (body: PartsDetailsBody) => recordParts(jobLineId, body),
    onSuccess: refresh,
  });
}
