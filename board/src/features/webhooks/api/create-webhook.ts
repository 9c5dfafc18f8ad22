import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { CreatedWebhook, CreateWebhookBody } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { webhooksQueryOptions } from './get-webhooks';

export function createWebhook(body: CreateWebhookBody): Promise<CreatedWebhook> {
  return officeApi.post<CreatedWebhook>('/webhooks', body);
}

export function useCreateWebhook() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: createWebhook,
    onSuccess: () => queryClient.invalidateQueries({ queryKey: webhooksQueryOptions().queryKey }),
  });
}
