import { useEffect, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { LIVE_EVENT_NAMES, type LiveEventName, type ServerToClientEvents } from '@baytime/shared';
import type { LiveLink } from '@baytime/shared/client';
import {
  createRefreshScheduler,
  LIVE_QUERIES,
  RECONNECT_QUERIES,
  type RefreshScheduler,
} from '@/lib/live-queries';
import { mutationKeys, queryKeys } from '@/lib/query-keys';
import { useOfficeLink, whenLive } from '@/lib/socket';

function follow<E extends LiveEventName>(link: LiveLink, event: E, scheduler: RefreshScheduler): () => void {
  const handler = ((payload: Parameters<ServerToClientEvents[E]>[0]) =>
    scheduler.mark(LIVE_QUERIES[event](payload))) as ServerToClientEvents[E];
  return link.on(event, handler);
}

/**
 * The office's one subscription from live events to cached queries, through `LIVE_QUERIES`: mounted
 * once in the office frame, so every page is fresh whichever one is open.
 */
export function useLiveQueries(): void {
  const link = useOfficeLink();
  const queryClient = useQueryClient();
  const previous = useRef<LiveLink | null>(null);
  useEffect(() => {
    if (!link) return;
    const dispatchRoot = queryKeys.dispatch()[0];
    const scheduler = createRefreshScheduler({
      invalidate: (queryKey) => void queryClient.invalidateQueries({ queryKey, refetchType: 'active' }),
      // A move in flight refetches when it settles; refetching now would undo it on screen.
      isHeld: (key) =>
        key[0] === dispatchRoot && queryClient.isMutating({ mutationKey: mutationKeys.moveLine() }) > 0,
    });
    const offs = LIVE_EVENT_NAMES.map((event) => follow(link, event, scheduler));
    offs.push(link.onReconnect(() => scheduler.mark(RECONNECT_QUERIES)));
    // A renewed sign-in opens a new link in place of the last: once it is up, what was sent between the
    // two is fetched again.
    if (previous.current && previous.current !== link)
      offs.push(whenLive(link, () => scheduler.mark(RECONNECT_QUERIES)));
    previous.current = link;
    return () => {
      for (const off of offs) off();
      scheduler.dispose();
    };
  }, [link, queryClient]);
}
