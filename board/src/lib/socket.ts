import { useCallback, useEffect, useRef, useSyncExternalStore } from 'react';
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

/** Runs `action` once the link is live, at once if it already is; returns the way to stop waiting. */
export function whenLive(link: Pick<LiveLink, 'getState' | 'subscribe'>, action: () => void): () => void {
  if (link.getState().status === 'live') {
    action();
    return () => {};
  }
  const stop = link.subscribe(() => {
    if (link.getState().status !== 'live') return;
    stop();
    action();
  });
  return stop;
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

/** The office link's state in three words: live, connecting, or down (refused counts as down). */
export type OfficeLinkStatus = 'connecting' | 'live' | 'down';

export function useOfficeLinkStatus(): OfficeLinkStatus {
  const { status } = useLinkState(useOfficeLink());
  return status === 'live' || status === 'connecting' ? status : 'down';
}

/** Runs `handler` on each of this live event while the office is signed in; the latest handler is used. */
export function useOfficeEvent<E extends keyof ServerToClientEvents>(
  event: E,
  handler: ServerToClientEvents[E],
): void {
  const link = useOfficeLink();
  const latest = useRef(handler);
  useEffect(() => {
    latest.current = handler;
  }, [handler]);
  useEffect(() => {
    if (!link) return;
    const relay = ((...args: Parameters<ServerToClientEvents[E]>) =>
      (latest.current as (...a: typeof args) => void)(...args)) as ServerToClientEvents[E];
    return link.on(event, relay);
  }, [link, event]);
}
