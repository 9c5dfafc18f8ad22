import { queryOptions, useQuery } from '@tanstack/react-query';
import type { TimerDto } from '@baytime/shared';
import { watchApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `GET /api/timers`: every running timer in the shop, reached or not, until someone stops it. */
export const getTimers = () => watchApi.get<TimerDto[]>('/timers');

export const timersQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.timers(),
    queryFn: getTimers,
    staleTime: 5_000,
    // A safety net for a missed live message; `timer.updated` normally refreshes it at once.
    refetchInterval: 30_000,
    refetchIntervalInBackground: true,
  });

export function useTimers(enabled = true) {
  return useQuery({ ...timersQueryOptions(), enabled });
}
