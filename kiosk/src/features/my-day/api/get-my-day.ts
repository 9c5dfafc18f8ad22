import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyDay } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export const getMyDay = () => api.get<MyDay>('/me/day');

export const myDayQueryOptions = (technicianId: number) =>
  queryOptions({
    queryKey: queryKeys.myDay.of(technicianId),
    queryFn: getMyDay,
    staleTime: 5_000,
    // A safety net for a missed live event; the live link normally refreshes it at once.
    refetchInterval: 60_000,
  });

export function useMyDay(technicianId: number) {
  return useQuery(myDayQueryOptions(technicianId));
}
