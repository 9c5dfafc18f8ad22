import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { LabourReport } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getLabourReport(week: string): Promise<LabourReport> {
  return officeApi.get<LabourReport>(`/reports/labour?week=${encodeURIComponent(week)}`);
}

export const labourReportQueryOptions = (week: string) =>
  queryOptions({ queryKey: queryKeys.reports.labour(week), queryFn: () => getLabourReport(week) });

export function useLabourReport(week: string) {
  return useQuery({ ...labourReportQueryOptions(week), placeholderData: keepPreviousData });
}
