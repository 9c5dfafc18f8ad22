import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OperationDto, UpdateOperationBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { operationsQueryOptions } from '@/lib/api/get-operations';

export function updateOperation({
  id,
  ...body
}: UpdateOperationBody & { id: number }): Promise<OperationDto> {
  return officeApi.patch<OperationDto>(`/operations/${id}`, body);
}

export function useUpdateOperation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: updateOperation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: operationsQueryOptions().queryKey }),
  });
}
