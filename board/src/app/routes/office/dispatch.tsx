import { Badge } from '@fluentui/react-components';
import { useOfficeToken } from '@/features/auth/hooks/use-office-token';
import { PartsControl } from '@/features/parts/components/parts-control';
import { useShop } from '@/features/shop/api/get-shop';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { DispatchView } from '@/features/dispatch/components/dispatch-view';
import { useLiveDispatch, type LiveLink } from '@/features/dispatch/hooks/use-live-dispatch';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

const LINK_BADGES: Record<LiveLink, { text: string; color: 'brand' | 'informative' | 'danger' }> = {
  live: { text: 'Live', color: 'brand' },
  connecting: { text: 'Connecting…', color: 'informative' },
  down: { text: 'Link lost: reconnecting', color: 'danger' },
};

export function Component() {
  const { role } = useOffice();
  const token = useOfficeToken();
  const link = useLiveDispatch(token);
  const shop = useShop();
  const nowMs = useMinuteNow();
  const canEdit = role === 'owner' || role === 'foreman';
  const badge = LINK_BADGES[link];

  return (
    <>
      <DispatchView
        timeZone={shop.data?.timeZone}
        canEdit={canEdit}
        lineTools={(line) => (
          <PartsControl
            line={line}
            label={`RO ${line.repairOrderNumber} line ${line.lineNo}: ${line.title}`}
            timeZone={shop.data?.timeZone}
            nowMs={nowMs}
            canEdit
          />
        )}
        headerActions={
          <>
            {!canEdit && (
              <Badge appearance="outline" color="informative">
                View only
              </Badge>
            )}
            <Badge appearance={link === 'down' ? 'filled' : 'tint'} color={badge.color} role="status">
              {badge.text}
            </Badge>
          </>
        }
      />
    </>
  );
}
