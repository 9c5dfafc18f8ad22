import { useNavigate } from 'react-router';
import { Button } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { paths } from '@/config/paths';
import { useOfficeToken } from '@/features/auth/hooks/use-office-token';
import { RepairOrdersTable } from '@/features/repair-orders/components/repair-orders-table';
import { useLiveRepairOrders } from '@/features/repair-orders/hooks/use-live-repair-orders';
import { useShop } from '@/features/shop/api/get-shop';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const shop = useShop();
  const { user, role } = useOffice();
  const navigate = useNavigate();
  useLiveRepairOrders(useOfficeToken());
  return (
    <>
      <PageHeader
        title="Repair orders"
        description="Every visit and its job lines."
        actions={
          <Button appearance="primary" onClick={() => void navigate(paths.repairOrderNew)}>
            New repair order
          </Button>
        }
      />
      <RepairOrdersTable
        timeZone={shop.data?.timeZone}
        me={user}
        canListPeople={role === 'owner' || role === 'foreman'}
      />
    </>
  );
}
