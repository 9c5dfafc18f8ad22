import { useLocation, useParams } from 'react-router';
import { useOfficeToken } from '@/features/auth/hooks/use-office-token';
import { RepairOrderDetail } from '@/features/repair-orders/components/repair-order-detail';
import { useLiveRepairOrders } from '@/features/repair-orders/hooks/use-live-repair-orders';
import { PartsControl } from '@/features/parts/components/parts-control';
import { useShop } from '@/features/shop/api/get-shop';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const { id } = useParams();
  const { role } = useOffice();
  const location = useLocation();
  const shop = useShop();
  const nowMs = useMinuteNow();
  useLiveRepairOrders(useOfficeToken());
  const created = (location.state as { created?: boolean } | null)?.created === true;
  return (
    <>
      <RepairOrderDetail
        key={id}
        id={Number(id)}
        timeZone={shop.data?.timeZone}
        units={shop.data?.units}
        canDispatch={role === 'owner' || role === 'foreman'}
        created={created}
        lineTools={(line) => (
          <PartsControl
            line={line}
            label={`line ${line.lineNo}: ${line.title}`}
            timeZone={shop.data?.timeZone}
            nowMs={nowMs}
            canEdit
          />
        )}
      />
    </>
  );
}
