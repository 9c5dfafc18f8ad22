import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BayDto } from '@baytime/shared';
import { watchApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

/** `GET /api/bays`: bay names, so a timer banner can say "Bay 4". */
export const getBays = () => watchApi.get<BayDto[]>('/bays');

export const baysQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.bays(), queryFn: getBays, staleTime: 10 * 60_000 });

export function useBays(enabled = true) {
  return useQuery({ ...baysQueryOptions(), enabled });
}
