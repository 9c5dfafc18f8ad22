import { queryOptions, useQuery } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';
import type { RepairOrderSummary } from './get-repair-orders';
import { queryKeys } from '@/lib/query-keys';

export function getRepairOrder(id: number): Promise<RepairOrderSummary> {
  return officeApi.get<RepairOrderSummary>(`/repair-orders/${id}`);
}

export const repairOrderQueryOptions = (id: number) =>
  queryOptions({ queryKey: queryKeys.repairOrder.one(id), queryFn: () => getRepairOrder(id) });

export function useRepairOrder(id: number) {
  return useQuery(repairOrderQueryOptions(id));
}
