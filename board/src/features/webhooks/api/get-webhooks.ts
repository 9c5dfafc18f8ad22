import { queryKeys } from '@/lib/query-keys';
import { queryOptions, useQuery } from '@tanstack/react-query';
import type { WebhookDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getWebhooks(): Promise<WebhookDto[]> {
  return officeApi.get<WebhookDto[]>('/webhooks');
}

export const webhooksQueryOptions = () =>
  queryOptions({ queryKey: queryKeys.webhooks(), queryFn: getWebhooks });

export function useWebhooks() {
  return useQuery(webhooksQueryOptions());
}
