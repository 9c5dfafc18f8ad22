import { PageHeader } from '@/components/page-header';
import { CreateWebhookCard, DeliveryLog, WebhooksTable } from '@/features/webhooks/components/webhooks-admin';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  return (
    <>
      <PageHeader
        title="Webhooks"
        description="The shop’s other systems hear of events as they happen: each delivery is signed, retried until it is taken, and logged below."
      />
      <CreateWebhookCard />
      <WebhooksTable />
      <DeliveryLog />
    </>
  );
}
