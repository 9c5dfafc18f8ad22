import { useQueryClient } from '@tanstack/react-query';

/** The views that show a line's parts: they read them again once a change is saved. */
const SHOWN_IN = [['dispatch'], ['repair-order'], ['repair-orders']] as const;

export function useRefreshPartsViews() {
  const queryClient = useQueryClient();
  return () => Promise.all(SHOWN_IN.map((queryKey) => queryClient.invalidateQueries({ queryKey })));
}
