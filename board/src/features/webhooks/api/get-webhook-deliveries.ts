import { queryKeys } from '@/lib/query-keys';
import { keepPreviousData, queryOptions, useQuery } from '@tanstack/react-query';
import type { Page, WebhookDeliveryDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

export function getWebhookDeliveries(cursor: string | null): Promise<Page<WebhookDeliveryDto>> {
  return officeApi.get<Page<WebhookDeliveryDto>>(
    `/webhooks/deliveries?limit=25${cursor ? `&cursor=${encodeURIComponent(cursor)}` : ''}`,
  );
}

export const webhookDeliveriesQueryOptions = (cursor: string | null) =>
  queryOptions({
    queryKey: queryKeys.webhookDeliveries.page(cursor),
    queryFn: () => getWebhookDeliveries(cursor),
  });

/** The log reloads every few seconds: retries land in it by themselves. */
export function useWebhookDeliveries(cursor: string | null) {
  return useQuery({
    ...webhookDeliveriesQueryOptions(cursor),
    refetchInterval: 5_000,
    placeholderData: keepPreviousData,
  });
}
