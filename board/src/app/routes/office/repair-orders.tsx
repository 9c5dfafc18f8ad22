import { PageHeader } from '@/components/page-header';
import { RepairOrdersTable } from '@/features/repair-orders/components/repair-orders-table';
import { useShop } from '@/features/shop/api/get-shop';

export function Component() {
  const shop = useShop();
  return (
    <>
      <PageHeader
        title="Repair orders"
        description="Every visit and its job lines. Writing new ones comes later."
      />
      <RepairOrdersTable timeZone={shop.data?.timeZone} />
    </>
  );
}
