import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FindingDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getRepairOrderFindings(repairOrderId: number): Promise<FindingDto[]> {
  return officeApi.get<FindingDto[]>(`/findings?repairOrderId=${repairOrderId}`);
}

export const repairOrderFindingsQueryOptions = (repairOrderId: number) =>
  queryOptions({
    queryKey: ['findings', { repairOrderId }],
    queryFn: () => getRepairOrderFindings(repairOrderId),
  });

export function useRepairOrderFindings(repairOrderId: number) {
  return useQuery(repairOrderFindingsQueryOptions(repairOrderId));
}
