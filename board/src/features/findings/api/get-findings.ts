import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FindingAnswer, FindingDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getFindings(answer: FindingAnswer): Promise<FindingDto[]> {
  return officeApi.get<FindingDto[]>(`/findings?answer=${answer}`);
}

export const findingsKey = ['findings'] as const;

export const findingsQueryOptions = (answer: FindingAnswer) =>
  queryOptions({ queryKey: [...findingsKey, answer], queryFn: () => getFindings(answer) });

export function useFindings(answer: FindingAnswer, enabled = true) {
  return useQuery({ ...findingsQueryOptions(answer), enabled });
}
