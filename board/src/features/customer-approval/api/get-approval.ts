import { queryOptions, useQuery } from '@tanstack/react-query';
import type { PublicApproval } from '@baytime/shared';
import { publicApi } from '@/lib/api-client';

/** The customer's page, read with the link's token and nothing else. */
export function getApproval(token: string): Promise<PublicApproval> {
  return publicApi.get<PublicApproval>(`/public/approvals/${encodeURIComponent(token)}`);
}

export const approvalQueryOptions = (token: string) =>
  queryOptions({ queryKey: ['customer-approval', token], queryFn: () => getApproval(token) });

export function useApproval(token: string) {
  // One read: a used link answers 410, so coming back to the tab must not replace the thank-you.
  return useQuery({ ...approvalQueryOptions(token), staleTime: Infinity, refetchOnWindowFocus: false });
}
