import { PageHeader } from '@/components/page-header';
import { CreateScreenCard, ScreensTable } from '@/features/screens/components/screens-admin';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  return (
    <>
      <PageHeader
        title="Kiosks"
        description="The technicians’ tablets. Each is paired once; it then says how many punches wait on it."
      />
      <CreateScreenCard kind="kiosk" />
      <ScreensTable kind="kiosk" />
    </>
  );
}
