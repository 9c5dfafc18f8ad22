import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Timecard } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getTimecard(technicianId: number, week: string): Promise<Timecard> {
  const query = new URLSearchParams({ technicianId: String(technicianId), week });
  return officeApi.get<Timecard>(`/timecards?${query.toString()}`);
}

export const timecardQueryOptions = (technicianId: number, week: string) =>
  queryOptions({
    queryKey: queryKeys.timecards.week(technicianId, week),
    queryFn: () => getTimecard(technicianId, week),
  });

export function useTimecard(technicianId: number | null, week: string | null) {
  return useQuery({
    ...timecardQueryOptions(technicianId ?? 0, week ?? ''),
    enabled: technicianId !== null && week !== null,
    // Keep last week's card on screen while the next one loads, so the page does not jump.
    placeholderData: keepPreviousData,
  });
}
