import { useEffect, useRef } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { LIVE_EVENT_NAMES, type LiveEventName, type MyDay, type ServerToClientEvents } from '@baytime/shared';
import { LIVE_QUERIES, myLineIdsOf, type KioskContext } from '@/lib/live-queries';
import { queryKeys } from '@/lib/query-keys';
import { onLive } from '@/lib/socket';

/**
 * The kiosk's one subscription from live events to cached queries, through `LIVE_QUERIES`: mounted
 * once under the routes, for as long as the page lives, across sign-ins and reconnects.
 */
export function useLiveQueries(technicianId: number | null): void {
  const queryClient = useQueryClient();
  const technician = useRef(technicianId);
  useEffect(() => {
    technician.current = technicianId;
  }, [technicianId]);

  useEffect(() => {
    const context = (): KioskContext => {
      const id = technician.current;
      const day = id === null ? undefined : queryClient.getQueryData<MyDay>(queryKeys.myDay.of(id));
      return { technicianId: id, myLineIds: myLineIdsOf(day) };
    };
    const follow = <E extends LiveEventName>(event: E) =>
      onLive(event, ((payload: Parameters<ServerToClientEvents[E]>[0]) => {
        for (const queryKey of LIVE_QUERIES[event](payload, context()))
          void queryClient.invalidateQueries({ queryKey });
      }) as ServerToClientEvents[E]);
    const offs = LIVE_EVENT_NAMES.map(follow);
    return () => offs.forEach((off) => off());
  }, [queryClient]);
}
