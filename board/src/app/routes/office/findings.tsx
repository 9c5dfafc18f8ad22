import { useSearchParams } from 'react-router';
import { PageHeader } from '@/components/page-header';
import { useShop } from '@/features/shop/api/get-shop';
import { FindingsInbox, type InboxTab } from '@/features/findings/components/findings-inbox';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const { role } = useOffice();
  const shop = useShop();
  const [params, setParams] = useSearchParams();
  const tab: InboxTab = params.get('show') === 'answered' ? 'answered' : 'pending';
  return (
    <>
      <PageHeader
        title="Findings"
        description="Extra work the technicians found. Word and price it for the customer, send the approval link, or record an answer given by phone or in person."
      />
      <FindingsInbox
        role={role}
        tab={tab}
        onTab={(next) => setParams(next === 'pending' ? {} : { show: next }, { replace: true })}
        timeZone={shop.data?.timeZone}
        labourRateCents={shop.data?.labourRateCents}
      />
    </>
  );
}
