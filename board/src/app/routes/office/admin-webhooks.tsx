import { PageHeader } from '@/components/page-header';
import { useShop } from '@/features/shop/api/get-shop';
import { CreateWebhookCard, DeliveryLog, WebhooksTable } from '@/features/webhooks/components/webhooks-admin';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const timeZone = useShop().data?.timeZone;
  return (
    <>
      <PageHeader
        title="Webhooks"
        description="The shop’s other systems hear of events as they happen: each delivery is signed, retried until it is taken, and logged below."
      />
      <CreateWebhookCard />
      <WebhooksTable timeZone={timeZone} />
      <DeliveryLog timeZone={timeZone} />
    </>
  );
}
