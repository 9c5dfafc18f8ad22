import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApprovalRequested } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { findingsKey } from './get-findings';

/**
 * Sends the customer a link to approve or decline the reviewed findings of the repair order, by
 * e-mail and by text; an older link for them stops working.
 */
export function requestApproval(id: number): Promise<ApprovalRequested> {
  return officeApi.post<ApprovalRequested>(`/findings/${id}/request-approval`);
}

export function useRequestApproval() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: requestApproval,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: findingsKey }),
  });
}
