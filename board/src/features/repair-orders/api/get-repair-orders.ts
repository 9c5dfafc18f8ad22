import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { RepairOrderPage, RepairOrderSummary } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export type { RepairOrderSummary };

/** One page of `GET /api/repair-orders`; `query` is made by `listQuery`. */
export function getRepairOrderPage(query: string): Promise<RepairOrderPage> {
  return officeApi.get<RepairOrderPage>(`/repair-orders?${query}`);
}

/** Under `repairOrdersKey`: a change to any RO marks every page stale; only the page on screen reloads. */
export const repairOrdersKey = ['repair-orders'] as const;

export const repairOrderPageQueryOptions = (query: string) =>
  queryOptions({
    queryKey: [...repairOrdersKey, 'page', query],
    queryFn: () => getRepairOrderPage(query),
    // The last page stays on screen while the next one loads, so the table does not jump.
    placeholderData: keepPreviousData,
  });

export function useRepairOrderPage(query: string) {
  return useQuery(repairOrderPageQueryOptions(query));
}
