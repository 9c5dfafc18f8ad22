import { PageHeader } from '@/components/page-header';
import { CreateScreenCard, ScreensTable } from '@/features/screens/components/screens-admin';
import { useShop } from '@/features/shop/api/get-shop';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const timeZone = useShop().data?.timeZone;
  return (
    <>
      <PageHeader title="Wall screens" description="TVs on the shop floor that show the live board." />
      <CreateScreenCard timeZone={timeZone} />
      <ScreensTable timeZone={timeZone} />
    </>
  );
}
