import { useCallback, useEffect, useRef, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { useOfficeLive, type LiveListener } from '@/lib/socket';
import { officeToken } from '@/lib/token-store';
import { reportsKey } from '../api/get-labour-report';

/** Reports are whole-week sums: a burst of punches refreshes them once, not once per punch. */
const REFRESH_GAP_MS = 20_000;

/** Keeps the reports on screen current while punches, lines and bays change on the floor. */
export function useReportsLive(): void {
  const token = useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
  const queryClient = useQueryClient();
  const last = useRef(0);
  const pending = useRef<ReturnType<typeof setTimeout> | null>(null);
  useEffect(() => () => void (pending.current && clearTimeout(pending.current)), []);

  const refresh = useCallback(() => {
    if (pending.current) return;
    const wait = Math.max(0, last.current + REFRESH_GAP_MS - Date.now());
    pending.current = setTimeout(() => {
      pending.current = null;
      last.current = Date.now();
      void queryClient.invalidateQueries({ queryKey: reportsKey });
    }, wait);
  }, [queryClient]);
  const wire = useCallback(
    (socket: LiveListener) => {
      socket.on('punch.recorded', refresh);
      socket.on('job-line.updated', refresh);
      socket.on('bay.updated', refresh);
    },
    [refresh],
  );
  useOfficeLive(token, wire, refresh);
}
