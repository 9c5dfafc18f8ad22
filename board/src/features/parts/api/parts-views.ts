import { useQueryClient } from '@tanstack/react-query';
import { queryKeys } from '@/lib/query-keys';

/** The views that show a line's parts: they read them again once a change is saved. */
const SHOWN_IN = [queryKeys.dispatch(), queryKeys.repairOrder.all(), queryKeys.repairOrders.all()];

export function useRefreshPartsViews() {
  const queryClient = useQueryClient();
  return () => Promise.all(SHOWN_IN.map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}
