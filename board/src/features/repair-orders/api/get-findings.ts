import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FindingDto, FindingsPage } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** An RO's findings: a handful per visit, well inside one page. */
export async function getRepairOrderFindings(repairOrderId: number): Promise<FindingDto[]> {
  return (await officeApi.get<FindingsPage>(`/findings?repairOrderId=${repairOrderId}&limit=100`)).items;
}

export const repairOrderFindingsQueryOptions = (repairOrderId: number) =>
  queryOptions({
    queryKey: ['findings', { repairOrderId }],
    queryFn: () => getRepairOrderFindings(repairOrderId),
  });

export function useRepairOrderFindings(repairOrderId: number) {
  return useQuery(repairOrderFindingsQueryOptions(repairOrderId));
}
