import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RepairOrderHistoryEntry } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getRepairOrderHistory(id: number): Promise<RepairOrderHistoryEntry[]> {
  return officeApi.get<RepairOrderHistoryEntry[]>(`/repair-orders/${id}/history`);
}

export const repairOrderHistoryQueryOptions = (id: number) =>
  queryOptions({ queryKey: ['repair-order-history', id], queryFn: () => getRepairOrderHistory(id) });

export function useRepairOrderHistory(id: number) {
  return useQuery(repairOrderHistoryQueryOptions(id));
}
