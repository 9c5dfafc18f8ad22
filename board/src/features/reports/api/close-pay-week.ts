import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PayWeekState } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `POST /api/pay-weeks/:week/close`: keeps the week's pay summary as it stands. */
export function closePayWeek(week: string): Promise<PayWeekState> {
  return officeApi.post<PayWeekState>(`/pay-weeks/${encodeURIComponent(week)}/close`, {});
}

export function useClosePayWeek() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: closePayWeek,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.reports.all() }),
  });
}
