import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreateRepairOrderBody, JobLineDto, RepairOrderStatus } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** What the server answers with: the RO and its lines, with ids. */
export interface CreatedRepairOrder {
  id: number;
  number: string;
  status: RepairOrderStatus;
  lines: JobLineDto[];
}

export function createRepairOrder(body: CreateRepairOrderBody): Promise<CreatedRepairOrder> {
  return officeApi.post<CreatedRepairOrder>('/repair-orders', body);
}

export function useCreateRepairOrder() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createRepairOrder,
    // The lists, the vehicle's last visit and the dispatch queue (other features' queries) changed.
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: ['repair-orders'] }),
        queryClient.invalidateQueries({ queryKey: ['vehicle'] }),
        queryClient.invalidateQueries({ queryKey: ['dispatch'] }),
      ]),
  });
}
