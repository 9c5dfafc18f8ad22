import { CONNECTION_WORDS, offlineSinceWords } from '@baytime/shared';
import { useEffect, useLayoutEffect, useState, type CSSProperties } from 'react';
import { Glyph } from '@/components/glyph';
import { forgetWallToken } from '@/lib/wall-session';
import { useLiveBoard } from '../hooks/use-live-board';
import { useWallLink } from '../hooks/use-wall-link';
import { useNow } from '../hooks/use-now';
import { kioskQueueText } from '../kiosk-queue';
import { serverNow } from '../server-clock';
import { formatTimeOfDay } from '../board-time';
import {
  defaultGridArea,
  pageAt,
  pageItems,
  unitPx,
  wallLayout,
  type GridArea,
  type Viewport,
} from '../wall-layout';
import { MOST_STRIP_PAGES, peopleLayout, queueSummary } from '../people-pages';
import { BayTile } from './bay-tile';
import { PeopleBoard } from './people-board';
import { PeopleStrip } from './people-strip';
import { LINK_LOST_AFTER_MS, linkLost, WallTopBar } from './wall-top-bar';
import styles from './wall.module.css';

const PAGE_MS = 15_000;
const TURN_MS = 5_000;

function useViewport(): Viewport {
  const [viewport, setViewport] = useState<Viewport>(() => ({
    width: window.innerWidth,
    height: window.innerHeight,
  }));
  useEffect(() => {
    const update = () => setViewport({ width: window.innerWidth, height: window.innerHeight });
    window.addEventListener('resize', update);
    return () => window.removeEventListener('resize', update);
  }, []);
  return viewport;
}

/**
 * The area the grid really has, in units, once the top bar (which a long shop name can grow) is laid
 * out. Give `ref` to the grid.
 */
function useGridArea(viewport: Viewport): [GridArea | undefined, (element: HTMLElement | null) => void] {
  const [element, ref] = useState<HTMLElement | null>(null);
  const [px, setPx] = useState<{ width: number; height: number }>();
  useLayoutEffect(() => {
    if (!element) return;
    const measure = () =>
      setPx((was) =>
        was?.width === element.clientWidth && was.height === element.clientHeight
          ? was
          : { width: element.clientWidth, height: element.clientHeight },
      );
    measure();
    const observer = new ResizeObserver(measure);
    observer.observe(element);
    return () => observer.disconnect();
  }, [element]);
  const u = unitPx(viewport);
  return [px && px.width > 0 ? { width: px.width / u, height: px.height / u } : undefined, ref];
}

/** The full-screen wall board for a paired screen. */
export function WallBoard({ token }: { token: string }) {
  const { board, link, downSince, refusal } = useLiveBoard(useWallLink(token));
  const localNow = useNow();
  const viewport = useViewport();
  const [gridArea, gridRef] = useGridArea(viewport);
  const [stripPages, setStripPages] = useState(1);

  if (refusal)
    return (
      <main className={styles.wall}>
        <div className={styles.message} role="alert">
          <div className={styles.messageTitle}>This screen needs pairing again</div>
          <div className={styles.messageBody}>
            The shop server no longer accepts its pairing. Make a code in the office under Admin › Wall
            screens, then pair here.
          </div>
          <button className={styles.pairButton} type="button" onClick={forgetWallToken}>
            Pair this screen
          </button>
        </div>
      </main>
    );

  if (!board) {
    const long = downSince !== null && localNow - downSince >= LINK_LOST_AFTER_MS;
    return (
      <main className={styles.wall}>
        <div className={styles.message} role="status">
          {long && <Glyph name="link-lost" className={styles.glyph} />}
          <div className={styles.messageTitle}>
            {long ? offlineSinceWords(formatTimeOfDay(downSince, undefined)) : CONNECTION_WORDS.connecting}
          </div>
          {long && <div className={styles.messageBody}>Retrying by itself. Check the screen’s network.</div>}
        </div>
      </main>
    );
  }

  const { snapshot, clock, bayAsOf } = board;
  const now = serverNow(clock, localNow);
  const layout = wallLayout(snapshot.bays.length, viewport, gridArea);
  // People the strip would take many turns to show also get pages of their own, after the bays'.
  const people =
    stripPages > MOST_STRIP_PAGES
      ? peopleLayout(snapshot.people.length, gridArea ?? defaultGridArea(viewport))
      : null;
  const pages = layout.pages + (people?.pages ?? 0);
  const page = pageAt(pages, now, PAGE_MS);
  const bays = pageItems(snapshot.bays, layout, page);
  const turn = Math.floor(now / TURN_MS);
  const lost = linkLost(link, downSince, localNow);

  return (
    <main className={styles.wall} aria-label={`${snapshot.shop.name} board`}>
      <WallTopBar
        shopName={snapshot.shop.name}
        timeZone={snapshot.shop.timeZone}
        nowMs={now}
        localNowMs={localNow}
        link={link}
        downSince={downSince}
        offsetMs={clock.offsetMs}
        page={page}
        pages={pages}
        kioskNote={kioskQueueText(snapshot.kioskQueues, snapshot.shop.timeZone)}
        lateLines={snapshot.lateLines}
      />
      {people && page >= layout.pages ? (
        <PeopleBoard
          people={snapshot.people}
          nowMs={now}
          layout={people}
          page={page - layout.pages}
          areaRef={gridRef}
        />
      ) : snapshot.bays.length === 0 ? (
        <div className={styles.message} style={{ gridRow: 'auto' }}>
          <div className={styles.messageTitle}>No bays yet</div>
          <div className={styles.messageBody}>Add bays in the office under Admin, Bays.</div>
        </div>
      ) : (
        <section
          ref={gridRef}
          className={styles.grid}
          style={
            {
              gridTemplateColumns: `repeat(${layout.columns}, minmax(0, 1fr))`,
              gridTemplateRows: `repeat(${layout.rows}, minmax(0, 1fr))`,
              '--tile-scale': layout.scale,
            } as CSSProperties
          }
        >
          {bays.map((bay) => (
            <BayTile
              key={bay.id}
              bay={bay}
              asOfMs={bayAsOf[bay.id]}
              nowMs={now}
              timeZone={snapshot.shop.timeZone}
              height={layout.tileHeight}
              width={layout.tileWidth}
              scale={layout.scale}
              turn={turn}
            />
          ))}
        </section>
      )}
      <PeopleStrip
        people={snapshot.people}
        nowMs={now}
        turn={turn}
        queue={lost ? null : queueSummary(snapshot.queue, now)}
        onPageCount={setStripPages}
        offJobsOnly={people !== null}
      />
    </main>
  );
}
