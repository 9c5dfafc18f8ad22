import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { PayReport } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getPayReport(week: string): Promise<PayReport> {
  return officeApi.get<PayReport>(`/reports/pay?week=${encodeURIComponent(week)}`);
}

export const payReportQueryOptions = (week: string) =>
  queryOptions({ queryKey: queryKeys.reports.pay(week), queryFn: () => getPayReport(week) });

export function usePayReport(week: string, enabled = true) {
  return useQuery({ ...payReportQueryOptions(week), enabled, placeholderData: keepPreviousData });
}
