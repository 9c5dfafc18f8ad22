import type { BoardSnapshot } from '../board/board.schema.js';
import { readLiveRefusal, type LiveRefusal, type ServerToClientEvents } from '../live/live.events.js';

/**
 * What the link needs of a socket.io-client socket. Apps pass a real
 * `Socket<ServerToClientEvents, ClientToServerEvents>`; tests pass a stand-in.
 */
export interface LiveSocket {
  readonly connected: boolean;
  connect(): unknown;
  disconnect(): unknown;
  on(event: string, handler: (...args: never[]) => void): unknown;
  off(event: string, handler: (...args: never[]) => void): unknown;
  timeout(ms: number): {
    emit(event: 'board.snapshot', ack: (error: Error | null, snapshot: BoardSnapshot) => void): unknown;
  };
}

/**
 * The one reconnection policy of every app: Socket.IO's own, from 0.5 s up to 1 s, with ±50 % jitter
 * on the first tries, so a roomful of screens and tablets does not come back in step after a restart:
 * their tries stay spread across the second, and none waits more than a second once the server is
 * back. A longer wait would spare the server little: a thousand handshakes cost it the same CPU
 * however they are spread, more than a second of it on two cores. WebSocket first, HTTP long-polling
 * only where a WebSocket cannot open: a handshake over polling and its upgrade take the server four
 * or five requests instead of one. A try at a server that is down is two refused TCP connections: a
 * thousand tablets trying every second cost it nothing.
 */
export const LIVE_SOCKET_OPTIONS = {
  reconnectionDelay: 500,
  reconnectionDelayMax: 1_000,
  randomizationFactor: 0.5,
  transports: ['websocket', 'polling'] as ('websocket' | 'polling')[],
  tryAllTransports: true,
};

export type LinkStatus = 'connecting' | 'live' | 'down' | 'refused';

export interface LinkState {
  status: LinkStatus;
  /** Local time the link was lost (or the first attempt began); null while live. */
  downSince: number | null;
  /** Why the server refused or ended the connection; the link then stays closed. */
  refusal: LiveRefusal | null;
}

export interface LiveLinkOptions {
  socket: LiveSocket;
  /** The server refused this token, with a reason code: the app decides where that leads. */
  onRefused?: (refusal: LiveRefusal) => void;
  now?: () => number;
}

type EventName = keyof ServerToClientEvents;

export interface LiveLink {
  /** Listens to a server event for as long as the link lives; returns the way to stop. */
  on<E extends EventName>(event: E, handler: ServerToClientEvents[E]): () => void;
  /** Runs after the link came back, when messages may have been missed. */
  onReconnect(listener: () => void): () => void;
  getState(): LinkState;
  subscribe(listener: () => void): () => void;
  /** A fresh snapshot from the server, or null when the link is down or no answer came in time. */
  requestSnapshot(timeoutMs?: number): Promise<BoardSnapshot | null>;
  start(): void;
  close(): void;
}

/**
 * One live connection: Socket.IO reconnects by itself after a drop; a refusal from the handshake
 * (`connect_error` with a reason code) or a `session.ended` closes the link for good and says why.
 * Nothing here guesses from error text. `close` then `start` again picks up where it was (React's
 * development double effects do that), unless the server refused the token.
 */
export function createLiveLink({ socket, onRefused, now = Date.now }: LiveLinkOptions): LiveLink {
  let state: LinkState = { status: 'connecting', downSince: now(), refusal: null };
  const stateListeners = new Set<() => void>();
  const reconnectListeners = new Set<() => void>();
  const handlers = new Set<[string, (...args: never[]) => void]>();
  let connectedBefore = false;
  let running = false;

  const set = (patch: Partial<LinkState>) => {
    state = { ...state, ...patch };
    for (const listener of stateListeners) listener();
  };
  const markDown = () => set({ status: 'down', downSince: state.downSince ?? now() });

  const refuse = (refusal: LiveRefusal) => {
    if (state.refusal) return;
    close();
    set({ status: 'refused', refusal, downSince: state.downSince ?? now() });
    onRefused?.(refusal);
  };

  const own: [string, (...args: never[]) => void][] = [
    [
      'connect',
      () => {
        set({ status: 'live', downSince: null });
        if (connectedBefore) for (const listener of reconnectListeners) listener();
        connectedBefore = true;
      },
    ],
    [
      'disconnect',
      (reason: string) => {
        markDown();
        // The server closed this connection without a session.ended: the handshake will say why.
        if (reason === 'io server disconnect') socket.connect();
      },
    ],
    [
      'connect_error',
      (error: Error & { data?: unknown }) => {
        const refusal = readLiveRefusal(error.data);
        if (refusal) refuse(refusal);
        else markDown();
      },
    ],
    ['session.ended', (refusal: LiveRefusal) => refuse(readLiveRefusal(refusal) ?? refusal)],
  ];

  function close() {
    if (!running) return;
    running = false;
    for (const entry of [...own, ...handlers]) socket.off(...entry);
    socket.disconnect();
  }

  return {
    on(event, handler) {
      const entry: [string, (...args: never[]) => void] = [event, handler as (...args: never[]) => void];
      handlers.add(entry);
      if (running) socket.on(...entry);
      return () => {
        handlers.delete(entry);
        socket.off(...entry);
      };
    },
    onReconnect(listener) {
      reconnectListeners.add(listener);
      return () => void reconnectListeners.delete(listener);
    },
    getState: () => state,
    subscribe(listener) {
      stateListeners.add(listener);
      return () => void stateListeners.delete(listener);
    },
    requestSnapshot(timeoutMs = 5_000) {
      if (!running || !socket.connected) return Promise.resolve(null);
      return new Promise((resolve) =>
        socket
          .timeout(timeoutMs)
          .emit('board.snapshot', (error, snapshot) => resolve(error || !running ? null : snapshot)),
      );
    },
    start() {
      if (running || state.refusal) return;
      running = true;
      if (state.status === 'live') set({ status: 'connecting', downSince: now() });
      for (const entry of [...own, ...handlers]) socket.on(...entry);
      socket.connect();
    },
    close,
  };
}
