import { Badge } from '@fluentui/react-components';
import { CONNECTION_WORDS } from '@baytime/shared';
import { PartsControl } from '@/features/parts/components/parts-control';
import { useShop } from '@/features/shop/api/get-shop';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { DispatchView } from '@/features/dispatch/components/dispatch-view';
import { useOfficeLinkStatus, type OfficeLinkStatus } from '@/lib/socket';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

const LINK_BADGES: Record<OfficeLinkStatus, { text: string; color: 'brand' | 'informative' | 'danger' }> = {
  live: { text: CONNECTION_WORDS.online, color: 'brand' },
  connecting: { text: CONNECTION_WORDS.connecting, color: 'informative' },
  down: { text: CONNECTION_WORDS.offline, color: 'danger' },
};

export function Component() {
  const { role } = useOffice();
  const link = useOfficeLinkStatus();
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
