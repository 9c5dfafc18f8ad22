import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WebhookDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { queryKeys } from '@/lib/query-keys';
import { webhooksQueryOptions } from './get-webhooks';

export function revokeWebhook(id: number): Promise<WebhookDto> {
  return officeApi.delete<WebhookDto>(`/webhooks/${id}`);
}

/** Stopping an endpoint cancels its pending deliveries: the log is read again with the endpoints. */
export function useRevokeWebhook() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeWebhook,
    onSuccess: () =>
      Promise.all([
        queryClient.invalidateQueries({ queryKey: webhooksQueryOptions().queryKey }),
        queryClient.invalidateQueries({ queryKey: queryKeys.webhookDeliveries.all() }),
      ]),
  });
}
