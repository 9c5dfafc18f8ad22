import { queryKeys } from '@/lib/query-keys';
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { IntegrationKeyDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getIntegrationKeys(): Promise<IntegrationKeyDto[]> {
  return officeApi.get<IntegrationKeyDto[]>('/integration-keys');
}

export const integrationKeysQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.integrationKeys(), queryFn: getIntegrationKeys });

/** Reloads now and then, so a key's last use shows without a reload. */
export function useIntegrationKeys() {
  return useQuery({ ...integrationKeysQueryOptions(), refetchInterval: 30_000 });
}
