import { useCallback } from 'react';
import { useMutation, useQueryClient } from '@tanstack/react-query';
import type {
  AddJobLineBody,
  BayDto,
  CancelJobLineBody,
  EditJobLineBody,
  EditRepairOrderBody,
  JobLineDto,
  NoticesQueued,
  PatchJobLineBody,
  RepairOrderSummary,
} from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { repairOrderQueryOptions } from './get-repair-order';

/** Every change to an RO from its page: the RO, its history, the lists and dispatch are read again. */
function useRepairOrderChange<Vars, Result>(repairOrderId: number, send: (vars: Vars) => Promise<Result>) {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: send,
    onSuccess: () =>
      Promise.all(
        [
          queryKeys.repairOrder.one(repairOrderId),
          queryKeys.repairOrderHistory.one(repairOrderId),
          queryKeys.repairOrders.all(),
          queryKeys.dispatch(),
        ].map((queryKey) => queryClient.invalidateQueries({ queryKey })),
      ),
  });
}

/**
 * The server refused an edit because the RO or line changed since the dialog read it (or the RO was
 * closed meanwhile): reading it again is the way on, not another try.
 */
export const isStaleEdit = (error: unknown): error is ApiError =>
  error instanceof ApiError && error.status === 409;

/** The RO read again from the server (the page follows), for a dialog that was refused on stale data. */
export function useReloadRepairOrder(id: number): () => Promise<RepairOrderSummary> {
  const queryClient = useQueryClient();
  return useCallback(
    () => queryClient.fetchQuery({ ...repairOrderQueryOptions(id), staleTime: 0 }),
    [queryClient, id],
  );
}

export const useEditRepairOrder = (id: number) =>
  useRepairOrderChange(id, (body: EditRepairOrderBody) =>
    officeApi.patch<RepairOrderSummary>(`/repair-orders/${id}`, body),
  );

export const useAddJobLine = (id: number) =>
  useRepairOrderChange(id, (body: AddJobLineBody) =>
    officeApi.post<JobLineDto>(`/repair-orders/${id}/lines`, body),
  );

export const useReorderLines = (id: number) =>
  useRepairOrderChange(id, (lineIds: number[]) =>
    officeApi.put<RepairOrderSummary>(`/repair-orders/${id}/line-order`, { lineIds }),
  );

export const useEditJobLine = (id: number) =>
  useRepairOrderChange(id, ({ lineId, body }: { lineId: number; body: EditJobLineBody }) =>
    officeApi.patch<JobLineDto>(`/job-lines/${lineId}/details`, body),
  );

export const useCancelJobLine = (id: number) =>
  useRepairOrderChange(id, ({ lineId, body }: { lineId: number; body: CancelJobLineBody }) =>
    officeApi.post<JobLineDto>(`/job-lines/${lineId}/cancel`, body),
  );

/** A comeback: a finished line goes back to the queue, audited as opened again. */
export const useReopenJobLine = (id: number) =>
  useRepairOrderChange(id, (lineId: number) =>
    officeApi.patch<JobLineDto>(`/job-lines/${lineId}`, { status: 'queued' } satisfies PatchJobLineBody),
  );

export const useDeleteJobLine = (id: number) =>
  useRepairOrderChange(id, (lineId: number) => officeApi.delete<void>(`/job-lines/${lineId}`));

/** The vehicle is picked up: the RO closes and its bay is free. */
export const useCloseRepairOrder = (id: number) =>
  useRepairOrderChange(id, () => officeApi.post<RepairOrderSummary>(`/repair-orders/${id}/close`));

/** Tells the customer the vehicle is ready (e-mail and text), with the work done and the findings they declined. */
export const useSendReadyNotice = (id: number) =>
  useRepairOrderChange(id, () => officeApi.post<NoticesQueued>(`/repair-orders/${id}/ready-notice`));

/** The road test or final look is done: the bay holding the RO goes to ready. */
export const useRecordFinalCheck = (id: number) =>
  useRepairOrderChange(id, (bayId: number) => officeApi.post<BayDto>(`/bays/${bayId}/final-check`, {}));
