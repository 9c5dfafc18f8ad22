import { useMutation } from '@tanstack/react-query';
import type { NoticesQueued } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** Tells the customer the vehicle is ready, by e-mail and text, with the work done and what they declined. */
export function sendReadyNotice(repairOrderId: number): Promise<NoticesQueued> {
  return officeApi.post<NoticesQueued>(`/repair-orders/${repairOrderId}/ready-notice`);
}

export function useSendReadyNotice() {
  return useMutation({ mutationFn: sendReadyNotice });
}
