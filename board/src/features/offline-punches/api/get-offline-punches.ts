import { queryOptions, useQuery } from '@tanstack/react-query';
import type { OfflinePunchDto, OfflinePunchStatus, Page } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** `GET /api/offline-punches?status=`: newest tapped first, one page of 100. */
export function getOfflinePunches(status: OfflinePunchStatus | null): Promise<Page<OfflinePunchDto>> {
  return officeApi.get<Page<OfflinePunchDto>>(
    `/offline-punches?limit=100${status ? `&status=${status}` : ''}`,
  );
}

export const offlinePunchesKey = ['offline-punches'] as const;

export const offlinePunchesQueryOptions = (status: OfflinePunchStatus | null) =>
  queryOptions({ queryKey: [...offlinePunchesKey, status], queryFn: () => getOfflinePunches(status) });

export function useOfflinePunches(status: OfflinePunchStatus | null) {
  return useQuery({ ...offlinePunchesQueryOptions(status), refetchInterval: 30_000 });
}
