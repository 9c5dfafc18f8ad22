import { useSyncExternalStore } from 'react';
import type { LiveRefusal, ServerToClientEvents } from '@baytime/shared';
import { createLiveLink, LIVE_SOCKET_OPTIONS, type LiveLink, type LiveSocket } from '@baytime/shared/client';

export type LinkState = 'connecting' | 'online' | 'offline';
type EventName = keyof ServerToClientEvents;
type Handler = (payload: never) => void;

interface Current {
  token: string;
  link: LiveLink | null;
  /** Events this link already passes on to the registered handlers. */
  passed: Set<EventName>;
  offs: (() => void)[];
}

let current: Current | null = null;
let state: LinkState = 'offline';
let onRefused: ((refusal: LiveRefusal) => void) | null = null;
const stateListeners = new Set<() => void>();
const handlers = new Map<EventName, Set<Handler>>();

function setState(next: LinkState) {
  if (state === next) return;
  state = next;
  for (const listener of stateListeners) listener();
}

function pass(to: Current, event: EventName) {
  if (!to.link || to.passed.has(event)) return;
  to.passed.add(event);
  const handler = (payload: never) => {
    for (const each of handlers.get(event) ?? []) each(payload);
  };
  to.offs.push(to.link.on(event, handler as ServerToClientEvents[EventName]));
}

function follow(to: Current, link: LiveLink) {
  to.link = link;
  const show = () => {
    const { status } = link.getState();
    setState(status === 'live' ? 'online' : status === 'connecting' ? 'connecting' : 'offline');
  };
  to.offs.push(link.subscribe(show));
  for (const event of handlers.keys()) pass(to, event);
  link.start();
  show();
}

/**
 * The kiosk's one live link, for the signed-in technician (or, while nobody is, the tablet's own
 * token, which hears the shop's timers). Socket.IO reconnects by itself; a refusal from the server
 * (expired, deactivated, revoked) goes to `refused`: the kiosk goes back to its sign-in screen, or
 * for the tablet's token to pairing.
 */
export const live = {
  connect(token: string, refused: (refusal: LiveRefusal) => void) {
    onRefused = refused;
    if (current?.token === token) return;
    live.disconnect();
    const mine: Current = { token, link: null, passed: new Set(), offs: [] };
    current = mine;
    setState('connecting');
    // Loaded once the tablet is paired: the pairing screen needs no live link.
    void import('socket.io-client')
      .then(({ io }) => {
        if (current !== mine) return;
        const socket = io({ auth: { token }, autoConnect: false, ...LIVE_SOCKET_OPTIONS });
        follow(
          mine,
          createLiveLink({
            socket: socket as unknown as LiveSocket,
            onRefused: (refusal) => onRefused?.(refusal),
          }),
        );
      })
      .catch(() => {
        if (current === mine) setState('offline');
      });
  },
  disconnect() {
    for (const off of current?.offs ?? []) off();
    current?.link?.close();
    current = null;
    setState('offline');
  },
  state: (): LinkState => state,
  subscribe(listener: () => void) {
    stateListeners.add(listener);
    return () => void stateListeners.delete(listener);
  },
};

/** Listens to a live event across reconnects and sign-ins, until the returned function is called. */
export function onLive<E extends EventName>(event: E, handler: ServerToClientEvents[E]): () => void {
  let set = handlers.get(event);
  if (!set) handlers.set(event, (set = new Set()));
  set.add(handler as Handler);
  if (current) pass(current, event);
  return () => void set.delete(handler as Handler);
}

export function useLinkState(): LinkState {
  return useSyncExternalStore(live.subscribe, live.state);
}
