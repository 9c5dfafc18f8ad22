import { useMutation } from '@tanstack/react-query';
import type { MailQueued } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** E-mails the customer that the vehicle is ready, with the work done and the findings they declined. */
export function sendReadyNotice(repairOrderId: number): Promise<MailQueued> {
  return officeApi.post<MailQueued>(`/repair-orders/${repairOrderId}/ready-notice`);
}

export function useSendReadyNotice() {
  return useMutation({ mutationFn: sendReadyNotice });
}
