import { queryOptions, useQuery } from '@tanstack/react-query';
import type { BayDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';

export function getBays(): Promise<BayDto[]> {
  return officeApi.get<BayDto[]>('/bays');
}

export const baysQueryOptions = () => queryOptions({ queryKey: queryKeys.bays(), queryFn: getBays });

export function useBays() {
  return useQuery(baysQueryOptions());
}
