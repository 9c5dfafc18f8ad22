import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CorrectionBody, PunchDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function createCorrection(body: CorrectionBody): Promise<PunchDto> {
  return officeApi.post<PunchDto>('/timecards/corrections', body);
}

export function useCreateCorrection() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createCorrection,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.timecards.all() }),
  });
}
