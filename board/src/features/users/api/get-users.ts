import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getUsers(): Promise<UserDto[]> {
  return officeApi.get<UserDto[]>('/users');
}

export const usersQueryOptions = () => queryOptions({ queryKey: ['users'], queryFn: getUsers });

export function useUsers() {
  return useQuery(usersQueryOptions());
}
