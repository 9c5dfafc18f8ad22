import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getUsers(): Promise<UserDto[]> {
  return officeApi.get<UserDto[]>('/users');
}

export const usersQueryOptions = () => queryOptions({ queryKey: queryKeys.users(), queryFn: getUsers });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
