import { useCallback, useEffect, useSyncExternalStore } from 'react';
import { io, type Socket } from 'socket.io-client';
import type { ClientToServerEvents, LiveRefusal, ServerToClientEvents } from '@baytime/shared';
import {
  createLiveLink,
  LIVE_SOCKET_OPTIONS,
  type LinkState,
  type LiveLink,
  type LiveSocket,
} from '@baytime/shared/client';
import { officeToken } from './token-store';

/** A live link to the shop server at this origin; it connects when started. */
export function createBoardLink(token: string, onRefused: (refusal: LiveRefusal) => void): LiveLink {
  const socket: Socket<ServerToClientEvents, ClientToServerEvents> = io({
    auth: { token },
    autoConnect: false,
    forceNew: true,
    ...LIVE_SOCKET_OPTIONS,
  });
  return createLiveLink({ socket: socket as unknown as LiveSocket, onRefused });
}

let office: { token: string; link: LiveLink } | null = null;

/**
 * The office's one link, for the signed-in token, shared by every page that listens. A refusal
 * (expired, deactivated) drops the token, and the office shows its sign-in page.
 */
function officeLink(): LiveLink | null {
  const token = officeToken.get();
  if (office?.token === token) return office.link;
  office?.link.close();
  office = null;
  if (!token) return null;
  const link = createBoardLink(token, () => officeToken.clear());
  link.start();
  office = { token, link };
  return link;
}

export function useOfficeLink(): LiveLink | null {
  return useSyncExternalStore(officeToken.subscribe, officeLink, officeLink);
}

const NO_LINK: LinkState = { status: 'down', downSince: null, refusal: null };

export function useLinkState(link: LiveLink | null): LinkState {
  const subscribe = useCallback((listener: () => void) => link?.subscribe(listener) ?? (() => {}), [link]);
  const getState = useCallback(() => link?.getState() ?? NO_LINK, [link]);
  return useSyncExternalStore(subscribe, getState, getState);
}

/** What a page's `wire` may listen to; its listeners go when the page does. */
export interface LiveListener {
  on<E extends keyof ServerToClientEvents>(event: E, handler: ServerToClientEvents[E]): void;
}

/**
 * A page's live updates over the office link while `token` is signed in: `wire` adds its
 * listeners; `onReconnect` runs when the link comes back, when messages may have been missed.
 */
export function useOfficeLive(
  token: string | null,
  wire: (live: LiveListener) => void,
  onReconnect: () => void,
): LinkState {
  const link = useOfficeLink();
  useEffect(() => {
    if (!token || !link) return;
    const offs = [link.onReconnect(onReconnect)];
    wire({ on: (event, handler) => void offs.push(link.on(event, handler)) });
    return () => offs.forEach((off) => off());
  }, [token, link, wire, onReconnect]);
  return useLinkState(token ? link : null);
}
