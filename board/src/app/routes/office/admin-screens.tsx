import { PageHeader } from '@/components/page-header';
import { CreateScreenCard, ScreensTable } from '@/features/screens/components/screens-admin';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  return (
    <>
      <PageHeader title="Wall screens" description="TVs on the shop floor that show the live board." />
      <CreateScreenCard />
      <ScreensTable />
    </>
  );
}
