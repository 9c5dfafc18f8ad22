import { queryKeys } from '@/lib/query-keys';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ExceptionList } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getExceptions(week: string): Promise<ExceptionList> {
  return officeApi.get<ExceptionList>(`/exceptions?week=${encodeURIComponent(week)}`);
}

export const exceptionsQueryOptions = (week: string) =>
  queryOptions({ queryKey: queryKeys.exceptions.week(week), queryFn: () => getExceptions(week) });

export function useExceptions(week: string) {
  return useQuery({ ...exceptionsQueryOptions(week), placeholderData: keepPreviousData });
}
