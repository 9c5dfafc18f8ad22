import { queryOptions, useQuery } from '@tanstack/react-query';
import type { AuthUser } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getMe(): Promise<AuthUser> {
  return officeApi.get<AuthUser>('/me');
}

export const meQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.me(), queryFn: getMe, staleTime: 5 * 60_000 });

export function useMe(enabled: boolean) {
  return useQuery({ ...meQueryOptions(), enabled });
}
