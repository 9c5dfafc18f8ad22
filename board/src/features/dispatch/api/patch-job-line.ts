import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { DispatchBoard, JobLineDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { applyMove, type MovePatch } from '../dispatch-model';
import { dispatchQueryOptions } from '@/lib/api/get-dispatch';
import { mutationKeys, queryKeys } from '@/lib/query-keys';

export interface MoveLineVariables extends MovePatch {
  id: number;
}

export function patchJobLine({ id, ...patch }: MoveLineVariables): Promise<JobLineDto> {
  return officeApi.patch<JobLineDto>(`/job-lines/${id}`, patch);
}

export const MOVE_LINE_KEY = mutationKeys.moveLine();

/** Moves a line at once on screen; puts it back if the server refuses. */
export function useMoveLine() {
  const queryClient = useQueryClient();
  const { queryKey } = dispatchQueryOptions();
  return useMutation({
    mutationKey: MOVE_LINE_KEY,
    mutationFn: patchJobLine,
    onMutate: async ({ id, ...patch }) => {
      await queryClient.cancelQueries({ queryKey });
      const before = queryClient.getQueryData<DispatchBoard>(queryKey);
      if (before) queryClient.setQueryData(queryKey, applyMove(before, id, patch));
      return { before };
    },
    onError: (_error, _variables, context) => {
      if (context?.before) queryClient.setQueryData(queryKey, context.before);
    },
    onSettled: () => {
      // Repair orders show line assignments too.
      void queryClient.invalidateQueries({ queryKey: queryKeys.repairOrders.all() });
      void queryClient.invalidateQueries({ queryKey: queryKeys.repairOrder.all() });
      if (queryClient.isMutating({ mutationKey: MOVE_LINE_KEY }) <= 1)
        return queryClient.invalidateQueries({ queryKey });
    },
  });
}
