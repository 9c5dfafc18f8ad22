import { queryOptions, useQuery } from '@tanstack/react-query';
import type { RepairOrderStatus, RepairOrderSummary } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export type { RepairOrderSummary };

export function getRepairOrders(status?: RepairOrderStatus): Promise<RepairOrderSummary[]> {
  return officeApi.get<RepairOrderSummary[]>(status ? `/repair-orders?status=${status}` : '/repair-orders');
}

export const repairOrdersQueryOptions = (status?: RepairOrderStatus) =>
  queryOptions({ queryKey: ['repair-orders', status ?? 'all'], queryFn: () => getRepairOrders(status) });

export function useRepairOrders(status?: RepairOrderStatus) {
  return useQuery(repairOrdersQueryOptions(status));
}
