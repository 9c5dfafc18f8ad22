import { useEffect, useState } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createBoardSocket } from '@/lib/socket';
import { dispatchQueryOptions } from '../api/get-dispatch';
import { MOVE_LINE_KEY } from '../api/patch-job-line';

export type LiveLink = 'connecting' | 'live' | 'down';

/** Events after which the dispatch view may be out of date. */
const EVENTS = [
  'job-line.updated',
  'punch.recorded',
  'finding.created',
  'bay.updated',
  'floor.updated',
] as const;

/** Bursts of events (an RO with many lines) cost one refetch. */
const SETTLE_MS = 250;

/**
 * Keeps the dispatch query fresh from the shop's socket: every relevant event marks it stale. The
 * snapshot the server sends on each (re)connect covers anything missed while the link was down.
 */
export function useLiveDispatch(token: string | null): LiveLink {
  const queryClient = useQueryClient();
  const [link, setLink] = useState<LiveLink>('connecting');

  useEffect(() => {
    if (!token) return;
    const socket = createBoardSocket(token);
    let timer: ReturnType<typeof setTimeout> | undefined;
    const refresh = () => {
      clearTimeout(timer);
      timer = setTimeout(() => {
        // A move in flight refetches when it settles; refetching now would undo it on screen.
        if (queryClient.isMutating({ mutationKey: MOVE_LINE_KEY }) > 0) return;
        void queryClient.invalidateQueries({ queryKey: dispatchQueryOptions().queryKey });
      }, SETTLE_MS);
    };
    for (const event of EVENTS) socket.on(event, refresh);
    // The first snapshot comes with the first connect, right after the page loaded its data; later
    // ones follow a reconnect, when events may have been missed.
    let connectedBefore = false;
    socket.on('board.snapshot', () => {
      if (connectedBefore) refresh();
      connectedBefore = true;
    });
    socket.on('connect', () => setLink('live'));
    socket.on('disconnect', () => setLink('down'));
    socket.io.on('reconnect_attempt', () => setLink('connecting'));
    // A refused token: the next request answers 401 and the office goes back to sign-in by itself.
    socket.on('auth.error', () => void queryClient.invalidateQueries({ queryKey: ['me'] }));
    socket.connect();
    return () => {
      clearTimeout(timer);
      socket.removeAllListeners();
      socket.io.removeAllListeners();
      socket.disconnect();
    };
  }, [token, queryClient]);

  return token ? link : 'down';
}
