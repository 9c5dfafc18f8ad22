import { queryOptions, useQuery } from '@tanstack/react-query';
import type { JobLineDto, RepairOrderStatus } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** How the list may give a vehicle: a ready description or its parts. */
export type RepairOrderVehicle =
  string | { vin?: string; year?: number; make?: string; model?: string; odometer?: number } | null;

/** One row of `GET /api/repair-orders` (no shared type for it yet). */
export interface RepairOrderListItem {
  id: number;
  number: string;
  customerName: string;
  vehicle: RepairOrderVehicle;
  status: RepairOrderStatus;
  promisedAt: string | null;
  lines: JobLineDto[];
}

export function getRepairOrders(status?: RepairOrderStatus): Promise<RepairOrderListItem[]> {
  return officeApi.get<RepairOrderListItem[]>(status ? `/repair-orders?status=${status}` : '/repair-orders');
}

export const repairOrdersQueryOptions = (status?: RepairOrderStatus) =>
  queryOptions({ queryKey: ['repair-orders', status ?? 'all'], queryFn: () => getRepairOrders(status) });

export function useRepairOrders(status?: RepairOrderStatus) {
  return useQuery(repairOrdersQueryOptions(status));
}
