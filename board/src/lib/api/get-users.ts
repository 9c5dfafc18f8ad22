import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** The shop's people: the users admin, timecards and the repair orders' advisor filter. Owners and foremen read them. */
export function getUsers(): Promise<UserDto[]> {
  return officeApi.get<UserDto[]>('/users');
}

export const usersQueryOptions = () => queryOptions({ queryKey: queryKeys.users(), queryFn: getUsers });

export function useUsers(enabled = true) {
  return useQuery({ ...usersQueryOptions(), enabled });
}
