import { PageHeader } from '@/components/page-header';
import { RepairOrderImport } from '@/features/repair-order-import/components/repair-order-import';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  return (
    <>
      <PageHeader
        title="Import repair orders"
        description="Bring in repair orders written in another system."
      />
      <RepairOrderImport />
    </>
  );
}
