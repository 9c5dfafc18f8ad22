import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OperationDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The shop's menu of operations with their default book hours. */
export function getOperations(): Promise<OperationDto[]> {
  return officeApi.get<OperationDto[]>('/operations');
}

export const operationsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.operations(), queryFn: getOperations, staleTime: 5 * 60_000 });

export function useOperations() {
  return useQuery(operationsQueryOptions());
}
