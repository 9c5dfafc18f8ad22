import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OperationDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The shop's active operations menu (the server lists only active ones). */
export function getOperations(): Promise<OperationDto[]> {
  return officeApi.get<OperationDto[]>('/operations');
}

/** Same key as the RO intake's operations picker, so invalidating it refreshes both. */
export const operationsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.operations(), queryFn: getOperations });

export function useOperations() {
  return useQuery(operationsQueryOptions());
}
