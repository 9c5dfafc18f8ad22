import type { BoardSnapshot, ClientToServerEvents, ServerToClientEvents } from '@baytime/shared';
import type { Socket } from 'socket.io-client';
import { applyEvent, boardFromSnapshot, type BoardData, type BoardEvent } from './board-store';

type BoardSocket = Socket<ServerToClientEvents, ClientToServerEvents>;

export type LinkStatus = 'connecting' | 'live' | 'down';

export interface LiveBoardState {
  board: BoardData | null;
  link: LinkStatus;
  /** Local time the link was last lost (or the first attempt began); null while live. */
  downSince: number | null;
}

export interface LiveBoardOptions {
  socket: BoardSocket;
  /** The token was refused: the caller forgets it and shows pairing or sign-in. */
  onUnauthorized: () => void;
  /**
   * Asks the server over HTTP whether the token still works, for handshake refusals that do not say
   * why; resolves false only on a definite 401.
   */
  checkToken?: () => Promise<boolean>;
  now?: () => number;
  /** A full snapshot every so often heals anything missed and renews the clock offset. */
  refreshEveryMs?: number;
  ackTimeoutMs?: number;
}

export interface LiveBoard {
  getState: () => LiveBoardState;
  subscribe: (listener: () => void) => () => void;
  start: () => void;
  stop: () => void;
  /** Ask for a fresh snapshot now (no-op while one is on its way or the link is down). */
  resync: () => void;
}

const AUTH_WORDS = /unauthori[sz]ed|forbidden|invalid token|jwt|auth/i;

/** Socket wiring for the live board, free of React so it can be tested with a fake socket. */
export function createLiveBoard(options: LiveBoardOptions): LiveBoard {
  const { socket, onUnauthorized, checkToken, refreshEveryMs = 10 * 60_000, ackTimeoutMs = 5_000 } = options;
  const now = options.now ?? Date.now;
  const listeners = new Set<() => void>();
  let state: LiveBoardState = { board: null, link: 'connecting', downSince: now() };
  let running = false;
  let refused = false;
  let resyncPending = false;
  let connectedBefore = false;
  let retryTimer: ReturnType<typeof setTimeout> | undefined;
  let refreshTimer: ReturnType<typeof setInterval> | undefined;
  let manualAttempts = 0;

  const set = (patch: Partial<LiveBoardState>) => {
    state = { ...state, ...patch };
    for (const listener of listeners) listener();
  };

  const takeSnapshot = (snapshot: BoardSnapshot) => {
    set({ board: boardFromSnapshot(snapshot, now()) });
  };

  const resync = () => {
    if (!running || resyncPending || !socket.connected) return;
    resyncPending = true;
    socket.timeout(ackTimeoutMs).emit('board.snapshot', (error: Error | null, snapshot: BoardSnapshot) => {
      resyncPending = false;
      // No answer in time: the next gap, reconnect or refresh asks again.
      if (error || !running) return;
      takeSnapshot(snapshot);
    });
  };

  const onEvent = (event: BoardEvent) => {
    const result = applyEvent(state.board, event, now());
    if (result.board !== state.board) set({ board: result.board });
    if (result.resync) resync();
  };

  const refuse = () => {
    if (refused) return;
    refused = true;
    stop();
    onUnauthorized();
  };

  /** socket.io gives up after a server-side disconnect or a middleware refusal: keep trying ourselves. */
  const retryLater = () => {
    if (!running || refused) return;
    clearTimeout(retryTimer);
    const delay = Math.min(15_000, 1_000 * 2 ** Math.min(manualAttempts, 4)) * (0.75 + Math.random() * 0.5);
    manualAttempts += 1;
    retryTimer = setTimeout(() => {
      if (running && !socket.connected) socket.connect();
    }, delay);
  };

  const markDown = () => {
    if (state.link !== 'down' || state.downSince === null)
      set({ link: 'down', downSince: state.downSince ?? now() });
  };

  const handlers = {
    connect: () => {
      manualAttempts = 0;
      set({ link: 'live', downSince: null });
      // The server sends a snapshot on connect; after a drop ask as well, in case that one is lost.
      if (connectedBefore) resync();
      connectedBefore = true;
    },
    disconnect: (reason: Socket.DisconnectReason) => {
      resyncPending = false;
      set({ link: 'down', downSince: state.downSince ?? now() });
      if (reason === 'io server disconnect') retryLater();
    },
    connect_error: (error: Error) => {
      markDown();
      if (socket.active) return;
      if (AUTH_WORDS.test(error.message)) {
        if (checkToken) {
          void checkToken().then((ok) => (ok ? retryLater() : refuse()), retryLater);
        } else refuse();
      } else retryLater();
    },
    'session.ended': () => refuse(),
    'board.snapshot': (snapshot: BoardSnapshot) => takeSnapshot(snapshot),
    'bay.updated': ({ seq, bay }: Parameters<ServerToClientEvents['bay.updated']>[0]) =>
      onEvent({ type: 'bay.updated', seq, bay }),
    'floor.updated': ({
      seq,
      people,
      queue,
      lateLines,
    }: Parameters<ServerToClientEvents['floor.updated']>[0]) =>
      onEvent({ type: 'floor.updated', seq, people, queue, lateLines }),
    'punch.recorded': ({ seq }: { seq: number }) => onEvent({ type: 'other', seq }),
    'job-line.updated': ({ seq }: { seq: number }) => onEvent({ type: 'other', seq }),
    'timer.updated': ({ seq }: { seq: number }) => onEvent({ type: 'other', seq }),
    'finding.created': ({ seq }: { seq: number }) => onEvent({ type: 'other', seq }),
  };

  function start() {
    if (running || refused) return;
    running = true;
    socket.on('connect', handlers.connect);
    socket.on('disconnect', handlers.disconnect);
    socket.on('connect_error', handlers.connect_error);
    socket.on('session.ended', handlers['session.ended']);
    socket.on('board.snapshot', handlers['board.snapshot']);
    socket.on('bay.updated', handlers['bay.updated']);
    socket.on('floor.updated', handlers['floor.updated']);
    socket.on('punch.recorded', handlers['punch.recorded']);
    socket.on('job-line.updated', handlers['job-line.updated']);
    socket.on('timer.updated', handlers['timer.updated']);
    socket.on('finding.created', handlers['finding.created']);
    refreshTimer = setInterval(resync, refreshEveryMs);
    socket.connect();
  }

  function stop() {
    if (!running) return;
    running = false;
    clearTimeout(retryTimer);
    clearInterval(refreshTimer);
    socket.off('connect', handlers.connect);
    socket.off('disconnect', handlers.disconnect);
    socket.off('connect_error', handlers.connect_error);
    socket.off('session.ended', handlers['session.ended']);
    socket.off('board.snapshot', handlers['board.snapshot']);
    socket.off('bay.updated', handlers['bay.updated']);
    socket.off('floor.updated', handlers['floor.updated']);
    socket.off('punch.recorded', handlers['punch.recorded']);
    socket.off('job-line.updated', handlers['job-line.updated']);
    socket.off('timer.updated', handlers['timer.updated']);
    socket.off('finding.created', handlers['finding.created']);
    socket.disconnect();
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
