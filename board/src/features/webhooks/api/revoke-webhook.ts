import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { WebhookDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { webhooksQueryOptions } from './get-webhooks';

export function revokeWebhook(id: number): Promise<WebhookDto> {
  return officeApi.delete<WebhookDto>(`/webhooks/${id}`);
}

export function useRevokeWebhook() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: revokeWebhook,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: webhooksQueryOptions().queryKey }),
  });
}
