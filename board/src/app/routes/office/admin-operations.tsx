import { PageHeader } from '@/components/page-header';
import { AddOperationForm, OperationsTable } from '@/features/operations/components/operations-admin';

export function Component() {
  return (
    <>
      <PageHeader
        title="Operations menu"
        description="The job lines an advisor picks from when writing a repair order, with their default book hours."
      />
      <AddOperationForm />
      <OperationsTable />
    </>
  );
}
