import { queryKeys } from '@/lib/query-keys';
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { DatedPayRules } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** `GET /api/shop/pay-rules`: every dated set of pay rules, oldest first. */
export function getPayRules(): Promise<DatedPayRules[]> {
  return officeApi.get<DatedPayRules[]>('/shop/pay-rules');
}

/** Under the shop's key, so saving the settings reads them again. */
export const payRulesQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.payRules(), queryFn: getPayRules });

export function usePayRules() {
  return useQuery(payRulesQueryOptions());
}
