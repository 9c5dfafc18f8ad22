import {
  LIVE_EVENT_NAMES,
  type BoardSnapshot,
  type LiveEventName,
  type LiveRefusal,
  type ServerToClientEvents,
} from '@baytime/shared';
import type { LinkStatus, LiveLink } from '@baytime/shared/client';
import { applyEvent, boardFromSnapshot, type BoardData, type BoardEvent } from './board-store';
import { setShopClockFormat } from '@/lib/shop-clock';

export type { LinkStatus };

export interface LiveBoardState {
  board: BoardData | null;
  link: LinkStatus;
  /** Local time the link was last lost (or the first attempt began); null while live. */
  downSince: number | null;
  /** Why the server refused this screen's token; the board then stays as it was. */
  refusal: LiveRefusal | null;
}

export interface LiveBoardOptions {
  link: LiveLink;
  now?: () => number;
  /** A full snapshot every so often heals anything missed and renews the clock offset. */
  refreshEveryMs?: number;
}

export interface LiveBoard {
  getState: () => LiveBoardState;
  subscribe: (listener: () => void) => () => void;
  start: () => void;
  stop: () => void;
  /** Ask for a fresh snapshot now (no-op while one is on its way or the link is down). */
  resync: () => void;
}

type Payload<E extends keyof ServerToClientEvents> = Parameters<ServerToClientEvents[E]>[0];

/** Events the board applies itself; `session.ended` carries no `seq` and is the link's. */
const APPLIED: ReadonlySet<LiveEventName> = new Set([
  'board.snapshot',
  'bay.updated',
  'floor.updated',
  'shop.updated',
  'session.ended',
]);

/**
 * The board kept true over a live link, free of React so it can be tested with a stand-in link:
 * events applied in `seq` order, and a snapshot asked for after a gap or a reconnect.
 */
export function createLiveBoard({
  link,
  now = Date.now,
  refreshEveryMs = 10 * 60_000,
}: LiveBoardOptions): LiveBoard {
  const listeners = new Set<() => void>();
  const fromLink = () => {
    const { status, downSince, refusal } = link.getState();
    return { link: status, downSince, refusal };
  };
  let state: LiveBoardState = { board: null, ...fromLink() };
  let running = false;
  let resyncPending = false;
  let offs: (() => void)[] = [];
  let refreshTimer: ReturnType<typeof setInterval> | undefined;

  const set = (patch: Partial<LiveBoardState>) => {
    state = { ...state, ...patch };
    for (const listener of listeners) listener();
  };

  const takeSnapshot = (snapshot: BoardSnapshot) => {
    setShopClockFormat(snapshot.shop.clockFormat);
    set({ board: boardFromSnapshot(snapshot, now()) });
  };

  const resync = () => {
    if (!running || resyncPending) return;
    resyncPending = true;
    void link.requestSnapshot().then((snapshot) => {
      resyncPending = false;
      // No answer in time: the next gap, reconnect or refresh asks again.
      if (snapshot && running) takeSnapshot(snapshot);
    });
  };

  const onEvent = (event: BoardEvent) => {
    const result = applyEvent(state.board, event, now());
    if (result.board !== state.board) set({ board: result.board });
    if (result.resync) resync();
  };
  const other = ({ seq }: { seq: number }) => onEvent({ type: 'other', seq });

  function start() {
    if (running) return;
    running = true;
    offs = [
      link.subscribe(() => set(fromLink())),
      // The server sends a snapshot on connect; after a drop ask as well, in case that one is lost.
      link.onReconnect(resync),
      link.on('board.snapshot', takeSnapshot),
      link.on('bay.updated', ({ seq, bay }: Payload<'bay.updated'>) =>
        onEvent({ type: 'bay.updated', seq, bay }),
      ),
      link.on(
        'floor.updated',
        ({ seq, people, queue, lateLines, bayIds, kioskQueues }: Payload<'floor.updated'>) =>
          onEvent({ type: 'floor.updated', seq, people, queue, lateLines, bayIds, kioskQueues }),
      ),
      // The shop's name, zone and rules are in the snapshot: a settings change asks for a fresh one.
      link.on('shop.updated', ({ seq }: Payload<'shop.updated'>) => {
        other({ seq });
        resync();
      }),
      // Every other event only moves `seq` on, so a gap is still seen.
      ...LIVE_EVENT_NAMES.filter((event) => !APPLIED.has(event)).map((event) =>
        link.on(event, other as ServerToClientEvents[typeof event]),
      ),
    ];
    refreshTimer = setInterval(resync, refreshEveryMs);
    set(fromLink());
    // A link already up (the office's, shared by its pages) sent its connect snapshot before this.
    if (state.link === 'live') resync();
  }

  function stop() {
    if (!running) return;
    running = false;
    resyncPending = false;
    clearInterval(refreshTimer);
    for (const off of offs) off();
    offs = [];
  }

  return {
    getState: () => state,
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    start,
    stop,
    resync,
  };
}
