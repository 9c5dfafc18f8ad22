import { queryOptions, useQuery } from '@tanstack/react-query';
import type { UserDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** The shop's people, for the advisor filter; only owners and foremen may read them. */
export function getPeople(): Promise<UserDto[]> {
  return officeApi.get<UserDto[]>('/users');
}

export const peopleQueryOptions = () =>
  queryOptions({ queryKey: ['users'], queryFn: getPeople, staleTime: 5 * 60_000 });

export function usePeople(enabled: boolean) {
  return useQuery({ ...peopleQueryOptions(), enabled });
}
