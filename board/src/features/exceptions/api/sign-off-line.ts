import type { JobLineDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { useResolution } from './resolve';

/** `POST /api/job-lines/:id/sign-off`: a line done without clocked time is flagged from now on. */
export function signOffLine({ id, reason }: { id: number; reason: string }): Promise<JobLineDto> {
  return officeApi.post<JobLineDto>(`/job-lines/${id}/sign-off`, { reason });
}

export const useSignOffLine = () => useResolution(signOffLine);
