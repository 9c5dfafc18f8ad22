import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OperationDto, OperationInput } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { operationsQueryOptions } from '@/lib/api/get-operations';

export function createOperation(body: OperationInput): Promise<OperationDto> {
  return officeApi.post<OperationDto>('/operations', body);
}

export function useCreateOperation() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createOperation,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: operationsQueryOptions().queryKey }),
  });
}
