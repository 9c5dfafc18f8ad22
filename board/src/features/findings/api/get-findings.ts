import { queryOptions, useQuery } from '@tanstack/react-query';
import type { FindingAnswer, FindingsPage } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** The newest hundred findings with that answer: the inbox shows no more at once. */
export function getFindings(answer: FindingAnswer): Promise<FindingsPage> {
  return officeApi.get<FindingsPage>(`/findings?answer=${answer}&limit=100`);
}

export const findingsKey = ['findings'] as const;

export const findingsQueryOptions = (answer: FindingAnswer) =>
  queryOptions({ queryKey: [...findingsKey, answer], queryFn: () => getFindings(answer) });

export function useFindings(answer: FindingAnswer, enabled = true) {
  return useQuery({ ...findingsQueryOptions(answer), enabled });
}
