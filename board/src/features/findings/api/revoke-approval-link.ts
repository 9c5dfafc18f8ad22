import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { ApprovalLinkDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { findingsKey } from './get-findings';

/** Withdraws a link the customer has not answered: it stops working at once. */
export function revokeApprovalLink(linkId: number): Promise<ApprovalLinkDto> {
  return officeApi.post<ApprovalLinkDto>(`/approval-links/${linkId}/revoke`);
}

export function useRevokeApprovalLink() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeApprovalLink,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: findingsKey }),
  });
}
