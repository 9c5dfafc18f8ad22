import { useCallback, useEffect, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useOfficeLive, type LiveListener } from '@/lib/socket';
import { dispatchQueryOptions } from '../api/get-dispatch';
import { MOVE_LINE_KEY } from '../api/patch-job-line';

export type LiveLink = 'connecting' | 'live' | 'down';

/** Events after which the dispatch view may be out of date. */
const EVENTS = [
  'job-line.updated',
  'punch.recorded',
  'finding.created',
  'finding.answered',
  'bay.updated',
  'floor.updated',
] as const;

/** Bursts of events (an RO with many lines) cost one refetch. */
const SETTLE_MS = 250;

/** Keeps the dispatch query fresh from the shop's socket: every relevant event marks it stale. */
export function useLiveDispatch(token: string | null): LiveLink {
  const queryClient = useQueryClient();
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);

  const refresh = useCallback(() => {
    clearTimeout(timer.current);
    timer.current = setTimeout(() => {
      // A move in flight refetches when it settles; refetching now would undo it on screen.
      if (queryClient.isMutating({ mutationKey: MOVE_LINE_KEY }) > 0) return;
      void queryClient.invalidateQueries({ queryKey: dispatchQueryOptions().queryKey });
    }, SETTLE_MS);
  }, [queryClient]);
  const wire = useCallback(
    (live: LiveListener) => {
      for (const event of EVENTS) live.on(event, refresh);
    },
    [refresh],
  );
  const { status } = useOfficeLive(token, wire, refresh);
  return status === 'live' || status === 'connecting' ? status : 'down';
}
