import { Spinner } from '@fluentui/react-components';
import { useOfficeLink } from '@/lib/socket';
import { PageHeader } from '@/components/page-header';
import { useLiveBoard } from '@/features/wall/hooks/use-live-board';
import { useNow } from '@/features/wall/hooks/use-now';
import { serverNow } from '@/features/wall/server-clock';
import { formatTimeOfDay } from '@/features/wall/board-time';
import { FloorLinkStatus, FloorView } from '@/features/wall/components/floor-view';

export function Component() {
  const { board, link, downSince } = useLiveBoard(useOfficeLink());
  const localNow = useNow();
  const now = board ? serverNow(board.clock, localNow) : localNow;
  const shop = board?.snapshot.shop;

  return (
    <>
      <PageHeader
        title="Floor"
        description={
          shop ? `${shop.name} · ${formatTimeOfDay(now, shop.timeZone)}` : 'The live state of every bay'
        }
        actions={
          <FloorLinkStatus
            link={link}
            downSince={downSince}
            localNowMs={localNow}
            offsetMs={board?.clock.offsetMs ?? 0}
            timeZone={shop?.timeZone}
          />
        }
      />
      {board ? (
        <FloorView snapshot={board.snapshot} bayAsOf={board.bayAsOf} nowMs={now} />
      ) : (
        <Spinner label="Connecting to the floor…" />
      )}
    </>
  );
}
