import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DispatchBoard } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getDispatch(): Promise<DispatchBoard> {
  return officeApi.get<DispatchBoard>('/dispatch');
}

/** Forecasts move with the clock: refetch each minute even when nothing on the floor changed. */
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
