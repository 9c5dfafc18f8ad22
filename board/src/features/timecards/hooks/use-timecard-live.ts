import { useEffect, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createBoardSocket } from '@/lib/socket';
import { officeToken } from '@/lib/token-store';
import { timecardsKey } from '../api/get-timecard';

/**
 * Refreshes a technician's cards when a punch lands for them. A gap in the shop's event
 * sequence or a reconnect means something may have been missed: refresh them all then.
 */
export function useTimecardLive(): void {
  const token = useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
  const queryClient = useQueryClient();

  useEffect(() => {
    if (!token) return;
    const socket = createBoardSocket(token);
    const refreshAll = () => void queryClient.invalidateQueries({ queryKey: timecardsKey });
    let lastSeq: number | null = null;
    let connectedBefore = false;
    socket.on('connect', () => {
      if (connectedBefore) refreshAll();
      connectedBefore = true;
    });
    socket.on('board.snapshot', (snapshot) => {
      lastSeq = snapshot.seq;
    });
    socket.onAny((_event: string, payload?: { seq?: unknown }) => {
      const seq = payload?.seq;
      if (typeof seq !== 'number' || _event === 'board.snapshot') return;
      if (lastSeq !== null && seq > lastSeq + 1) refreshAll();
      lastSeq = Math.max(lastSeq ?? seq, seq);
    });
    // Cards not on screen are only marked stale; the one on screen loads again.
    socket.on('punch.recorded', ({ punch }) => {
      void queryClient.invalidateQueries({ queryKey: [...timecardsKey, punch.technicianId] });
    });
    socket.connect();
    return () => {
      socket.removeAllListeners();
      socket.offAny();
      socket.disconnect();
    };
  }, [token, queryClient]);
}
