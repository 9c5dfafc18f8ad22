import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { PayWeekState, ReopenWeekBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `POST /api/pay-weeks/:week/reopen` with the owner's reason (audited). */
export function reopenPayWeek({ week, ...body }: ReopenWeekBody & { week: string }): Promise<PayWeekState> {
  return officeApi.post<PayWeekState>(`/pay-weeks/${encodeURIComponent(week)}/reopen`, body);
}

export function useReopenPayWeek() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: reopenPayWeek,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: queryKeys.reports.all() }),
  });
}
