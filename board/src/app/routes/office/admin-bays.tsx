import { PageHeader } from '@/components/page-header';
import { AddBayForm, BaysTable } from '@/features/bays/components/bays-admin';

export function Component() {
  return (
    <>
      <PageHeader title="Bays" description="Each active bay is a tile on the wall board, in this order." />
      <AddBayForm />
      <BaysTable />
    </>
  );
}
