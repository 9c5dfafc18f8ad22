import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { ExceptionList } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getExceptions(week: string): Promise<ExceptionList> {
  return officeApi.get<ExceptionList>(`/exceptions?week=${encodeURIComponent(week)}`);
}

export const exceptionsKey = ['exceptions'] as const;

export const exceptionsQueryOptions = (week: string) =>
  queryOptions({ queryKey: [...exceptionsKey, week], queryFn: () => getExceptions(week) });

export function useExceptions(week: string) {
  return useQuery({ ...exceptionsQueryOptions(week), placeholderData: keepPreviousData });
}
