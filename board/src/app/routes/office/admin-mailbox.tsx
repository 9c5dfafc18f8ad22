import { useSearchParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { useShop } from '@/features/shop/api/get-shop';
import { MailboxView } from '@/features/mailbox/components/mailbox-view';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const shop = useShop();
  const [params, setParams] = useSearchParams();
  return (
    <>
      <PageHeader
        title="Test mailbox"
        description="E-mail Baytime sent while no outgoing mail server is set up: nothing here reached a customer."
      />
      <MailboxView
        selected={params.get('message')}
        onSelect={(id) => setParams({ message: id }, { replace: true })}
        timeZone={shop.data?.timeZone}
      />
    </>
  );
}
