import { PageHeader } from '@/components/page-header';
import { OfflinePunchesList } from '@/features/offline-punches/components/offline-punches-list';
import { useShop } from '@/features/shop/api/get-shop';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const shop = useShop();
  return (
    <>
      <PageHeader
        title="Offline punches"
        description="Shift and break punches recorded at a kiosk without the server. They count once confirmed: at the technician’s next sign-in online, or here."
      />
      <OfflinePunchesList timeZone={shop.data?.timeZone} />
    </>
  );
}
