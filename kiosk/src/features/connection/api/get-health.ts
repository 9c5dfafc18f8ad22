import { queryOptions, useQuery } from '@tanstack/react-query';
import { api } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export interface Health {
  ok: boolean;
  version?: string;
}

export const getHealth = () => api.get<Health>('/health');

export const healthQueryOptions = () =>
  queryOptions({
    queryKey: queryKeys.health(),
    queryFn: getHealth,
    retry: false,
    refetchInterval: 15_000,
    refetchIntervalInBackground: false,
    networkMode: 'always',
  });

/** Asks the server how it is, every 15 s, while nobody is signed in and there is no live link. */
export function useHealth(enabled: boolean) {
  return useQuery({ ...healthQueryOptions(), enabled });
}
