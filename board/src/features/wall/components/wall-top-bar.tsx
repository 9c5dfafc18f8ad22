import { Glyph } from '@/components/glyph';
import type { LinkStatus } from '../live-board';
import { CONNECTION_WORDS, LINK_STATUS_CONNECTION, offlineSinceWords } from '@baytime/shared';
import { clockFace } from '@/lib/shop-clock';
import { formatTimeOfDay } from '../board-time';
import { PageMarks } from './page-marks';
import styles from './wall.module.css';

/** A link down for longer than this is worth telling the whole shop about. */
export const LINK_LOST_AFTER_MS = 10_000;

export function linkLost(link: LinkStatus, downSince: number | null, localNowMs: number): boolean {
  return link !== 'live' && downSince !== null && localNowMs - downSince >= LINK_LOST_AFTER_MS;
}

export interface WallTopBarProps {
  shopName: string;
  timeZone: string | undefined;
  /** Server time now (ms). */
  nowMs: number;
  /** Local time now (ms), for how long the link has been down. */
  localNowMs: number;
  link: LinkStatus;
  /** Local time the link went down. */
  downSince: number | null;
  /** Difference between server and local clocks, to tell when the link went down in shop time. */
  offsetMs: number;
  page: number;
  pages: number;
  /** Punches waiting on a kiosk, in words; null when none. */
  kioskNote: string | null;
  /** Open lines forecast to miss their promised time, across the shop. */
  lateLines: number;
}

export function WallTopBar(props: WallTopBarProps) {
  const {
    shopName,
    timeZone,
    nowMs,
    localNowMs,
    link,
    downSince,
    offsetMs,
    page,
    pages,
    kioskNote,
    lateLines,
  } = props;
  const face = clockFace(nowMs, timeZone);
  const lost = downSince !== null && linkLost(link, downSince, localNowMs);

  return (
    <header className={styles.topBar}>
      {lost ? (
        <div className={styles.linkLost} role="alert">
          <Glyph name="link-lost" className={styles.glyph} />
          <span className={styles.linkLostText}>
            {offlineSinceWords(formatTimeOfDay(downSince + offsetMs, timeZone))}
          </span>
        </div>
      ) : kioskNote ? (
        <div className={styles.kioskNote} role="status">
          <Glyph name="caution" className={styles.glyph} />
          <span className={styles.linkLostText}>{kioskNote}</span>
        </div>
      ) : (
        <div className={styles.shopName}>
          {shopName}
          {lateLines > 0 && (
            <span className={styles.lateNote}>
              {' · '}
              {lateLines} {lateLines === 1 ? 'line' : 'lines'} running late
            </span>
          )}
        </div>
      )}
      <PageMarks page={page} pages={pages} announced />
      {!lost && (
        <div className={styles.live}>
          <span className={`${styles.liveDot} ${link === 'live' ? '' : styles.liveDotDown}`} />
          {CONNECTION_WORDS[LINK_STATUS_CONNECTION[link]]}
        </div>
      )}
      <time className={styles.clock} dateTime={new Date(nowMs).toISOString()}>
        {face.time}
        {face.period && <span className={styles.clockPeriod}>{face.period}</span>}
      </time>
    </header>
  );
}
