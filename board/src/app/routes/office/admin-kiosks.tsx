import { PageHeader } from '@/components/page-header';
import { CreateScreenCard, ScreensTable } from '@/features/screens/components/screens-admin';
import { useShop } from '@/features/shop/api/get-shop';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const timeZone = useShop().data?.timeZone;
  return (
    <>
      <PageHeader
        title="Kiosks"
        description="The technicians’ tablets. Each is paired once; it then says how many punches wait on it."
      />
      <CreateScreenCard kind="kiosk" timeZone={timeZone} />
      <ScreensTable kind="kiosk" timeZone={timeZone} />
    </>
  );
}
