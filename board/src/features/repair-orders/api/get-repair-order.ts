import { queryOptions, useQuery } from '@tanstack/react-query';
import { officeApi } from '@/lib/api-client';
import type { RepairOrderSummary } from './get-repair-orders';

export function getRepairOrder(id: number): Promise<RepairOrderSummary> {
  return officeApi.get<RepairOrderSummary>(`/repair-orders/${id}`);
}

export const repairOrderQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['repair-order', id], queryFn: () => getRepairOrder(id) });

export function useRepairOrder(id: number) {
  return useQuery(repairOrderQueryOptions(id));
}
