import { queryOptions, useQuery } from '@tanstack/react-query';
import type { MyDay } from '@baytime/shared';
import { api } from '@/lib/api-client';

export const getMyDay = () => api.get<MyDay>('/me/day');

/** Keyed by technician, so one tech never sees the day of the one before on a shared tablet. */
export const myDayQueryOptions = (technicianId: number) =>
  queryOptions({
    queryKey: ['me', 'day', technicianId],
    queryFn: getMyDay,
    staleTime: 5_000,
    // A safety net for a missed live event; the live link normally refreshes it at once.
    refetchInterval: 60_000,
  });

export const myDayRootKey = ['me', 'day'] as const;

export function useMyDay(technicianId: number) {
  return useQuery(myDayQueryOptions(technicianId));
}
