import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DispatchBoard } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/**
 * The dispatch view, read here for what repair orders do not carry: technician names, bay names, time
 * clocked on open lines and their forecasts. Same key as the dispatch page, so both share one cache.
 */
export function getDispatch(): Promise<DispatchBoard> {
  return officeApi.get<DispatchBoard>('/dispatch');
}

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
