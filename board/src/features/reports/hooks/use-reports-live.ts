import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createBoardSocket } from '@/lib/socket';
import { officeToken } from '@/lib/token-store';
import { reportsKey } from '../api/get-labour-report';

/** Reports are whole-week sums: a burst of punches refreshes them once, not once per punch. */
const REFRESH_GAP_MS = 20_000;

/** Keeps the reports on screen current while punches, lines and bays change on the floor. */
export function useReportsLive(): void {
  const token = useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
  const queryClient = useQueryClient();

  useEffect(() => {
    if (!token) return;
    const socket = createBoardSocket(token);
    let last = 0;
    let pending: ReturnType<typeof setTimeout> | null = null;
    const refresh = () => {
      if (pending) return;
      const wait = Math.max(0, last + REFRESH_GAP_MS - Date.now());
      pending = setTimeout(() => {
        pending = null;
        last = Date.now();
        void queryClient.invalidateQueries({ queryKey: reportsKey });
      }, wait);
    };
    let connectedBefore = false;
    socket.on('connect', () => {
      if (connectedBefore) refresh();
      connectedBefore = true;
    });
    socket.on('punch.recorded', refresh);
    socket.on('job-line.updated', refresh);
    socket.on('bay.updated', refresh);
    socket.connect();
    return () => {
      if (pending) clearTimeout(pending);
      socket.removeAllListeners();
      socket.disconnect();
    };
  }, [token, queryClient]);
}
