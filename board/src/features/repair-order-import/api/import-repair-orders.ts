import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { RepairOrderImportBody, RepairOrderImportResult } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function importRepairOrders(body: RepairOrderImportBody): Promise<RepairOrderImportResult> {
  return officeApi.post<RepairOrderImportResult>('/repair-order-imports', body);
}

/** The RO lists and the floor show the imported ROs at once. */
export function useImportRepairOrders() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: importRepairOrders,
    onSuccess: () => queryClient.invalidateQueries(),
  });
}
