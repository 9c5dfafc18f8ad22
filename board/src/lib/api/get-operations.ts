import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OperationDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The shop's active operations menu with default book hours (the server lists only active ones). */
export function getOperations(): Promise<OperationDto[]> {
  return officeApi.get<OperationDto[]>('/operations');
}

/** The admin list and the RO intake's picker; a change from the admin page refreshes both. */
export const operationsQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.operations(), queryFn: getOperations, staleTime: 5 * 60_000 });

export function useOperations() {
  return useQuery(operationsQueryOptions());
}
