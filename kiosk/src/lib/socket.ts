import { useSyncExternalStore } from 'react';
import type { Socket } from 'socket.io-client';
import type { ClientToServerEvents, ServerToClientEvents } from '@baytime/shared';

export type KioskSocket = Socket<ServerToClientEvents, ClientToServerEvents>;
export type LinkState = 'connecting' | 'online' | 'offline';
type EventName = keyof ServerToClientEvents;
type Handler = (...args: never[]) => void;

let socket: KioskSocket | null = null;
let socketToken: string | null = null;
let state: LinkState = 'offline';
let retryTimer: ReturnType<typeof setTimeout> | undefined;
const stateListeners = new Set<() => void>();
const handlers = new Map<EventName, Set<Handler>>();
let onAuthError: ((message: string) => void) | null = null;
/** Bumped on every connect and disconnect, so a late module load cannot revive an old link. */
let generation = 0;

function setState(next: LinkState) {
  if (state === next) return;
  state = next;
  for (const listener of stateListeners) listener();
}

function attach(s: KioskSocket) {
  s.on('connect', () => setState('online'));
  s.on('disconnect', (reason) => {
    setState('offline');
    // The client reconnects by itself except after a server-side disconnect, e.g. a restart.
    if (reason === 'io server disconnect') {
      clearTimeout(retryTimer);
      retryTimer = setTimeout(() => {
        if (socket === s) s.connect();
      }, 3000);
    }
  });
  s.on('connect_error', () => setState('offline'));
  s.on('session.ended', ({ message }) => {
    clearTimeout(retryTimer);
    s.disconnect();
    onAuthError?.(message);
  });
  for (const [event, set] of handlers) for (const handler of set) s.on(event, handler as never);
}

/** One live link per signed-in technician; handlers registered with `onLive` survive reconnects. */
export const live = {
  connect(token: string, authError: (message: string) => void) {
    onAuthError = authError;
    if (socketToken === token) return;
    live.disconnect();
    socketToken = token;
    setState('connecting');
    const mine = ++generation;
    // Loaded only once someone signs in: the keypad screen needs no live link.
    void import('socket.io-client')
      .then(({ io }) => {
        if (mine !== generation) return;
        socket = io({ auth: { token }, reconnectionDelayMax: 10_000 });
        attach(socket);
      })
      .catch(() => {
        if (mine === generation) setState('offline');
      });
  },
  disconnect() {
    generation += 1;
    clearTimeout(retryTimer);
    socket?.removeAllListeners();
    socket?.disconnect();
    socket = null;
    socketToken = null;
    setState('offline');
  },
  state: (): LinkState => state,
  subscribe(listener: () => void) {
    stateListeners.add(listener);
    return () => void stateListeners.delete(listener);
  },
};

export function onLive<E extends EventName>(event: E, handler: ServerToClientEvents[E]): () => void {
  let set = handlers.get(event);
  if (!set) handlers.set(event, (set = new Set()));
  set.add(handler as Handler);
  socket?.on(event, handler as never);
  return () => {
    set.delete(handler as Handler);
    socket?.off(event, handler as never);
  };
}

export function useLinkState(): LinkState {
  return useSyncExternalStore(live.subscribe, live.state);
}
