import { useCallback, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useOfficeLive, type LiveListener } from '@/lib/socket';
import { officeToken } from '@/lib/token-store';
import { timecardsKey } from '../api/get-timecard';

/** Refreshes a technician's cards when a punch lands for them; all of them after a reconnect. */
export function useTimecardLive(): void {
  const token = useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
  const queryClient = useQueryClient();
  const refreshAll = useCallback(
    () => void queryClient.invalidateQueries({ queryKey: timecardsKey }),
    [queryClient],
  );
  const wire = useCallback(
    (socket: LiveListener) => {
      // Cards not on screen are only marked stale; the one on screen loads again.
      socket.on('punch.recorded', ({ punch }) => {
        void queryClient.invalidateQueries({ queryKey: [...timecardsKey, punch.technicianId] });
      });
    },
    [queryClient],
  );
  useOfficeLive(token, wire, refreshAll);
}
