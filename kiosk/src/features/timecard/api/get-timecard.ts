import { queryOptions, useQuery } from '@tanstack/react-query';
import type { Timecard } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `GET /api/timecards[?week=YYYY-Www]`: a technician gets their own card. */
export const getTimecard = (week?: string) =>
  api.get<Timecard>(week ? `/timecards?week=${encodeURIComponent(week)}` : '/timecards');

/** Under `me`, so it goes with the technician when they sign out. */
export const timecardQueryOptions = (technicianId: number, week?: string) =>
  queryOptions({
    queryKey: queryKeys.timecards.week(technicianId, week),
    queryFn: () => getTimecard(week),
    staleTime: 30_000,
  });

export function useTimecard(technicianId: number, week?: string) {
  return useQuery(timecardQueryOptions(technicianId, week));
}
