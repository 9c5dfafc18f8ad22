import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DispatchBoard } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getDispatch(): Promise<DispatchBoard> {
  return officeApi.get<DispatchBoard>('/dispatch');
}

/**
 * The dispatch view: the dispatch page's board, and what repair orders read from it (technician and
 * bay names, time clocked on open lines, forecasts). Forecasts move with the clock: it is fetched
 * again each minute even when nothing on the floor changed.
 */
export const dispatchQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.dispatch(),
    queryFn: getDispatch,
    staleTime: 15_000,
    refetchInterval: 60_000,
  });

export function useDispatch() {
  return useQuery(dispatchQueryOptions());
}
