import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { MailQueued } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { findingsKey } from './get-findings';

/** E-mails the customer the finding with its photos and asks for a yes or no (202: queued). */
export function requestApproval(id: number): Promise<MailQueued> {
  return officeApi.post<MailQueued>(`/findings/${id}/request-approval`);
}

export function useRequestApproval() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: requestApproval,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: findingsKey }),
  });
}
