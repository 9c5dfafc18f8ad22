import { useCallback, useEffect, useRef, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useOfficeLive, type LiveListener } from '@/lib/socket';
import { officeToken } from '@/lib/token-store';
import { findingsKey } from '../api/get-findings';

/** Keeps the inbox current: a new or answered finding or a changed job line reloads the lists; `onNew` hears each new finding's id. */
export function useFindingsLive(onNew: (findingId: number) => void): void {
  const token = useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
  const queryClient = useQueryClient();
  const onNewRef = useRef(onNew);
  useEffect(() => {
    onNewRef.current = onNew;
  }, [onNew]);

  const refresh = useCallback(
    () => void queryClient.invalidateQueries({ queryKey: findingsKey }),
    [queryClient],
  );
  const wire = useCallback(
    (socket: LiveListener) => {
      socket.on('finding.created', ({ findingId }) => {
        onNewRef.current(findingId);
        refresh();
      });
      socket.on('finding.answered', refresh);
      socket.on('job-line.updated', refresh);
    },
    [refresh],
  );
  useOfficeLive(token, wire, refresh);
}
