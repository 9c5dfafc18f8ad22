import { useEffect, useRef, useSyncExternalStore } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { createBoardSocket } from '@/lib/socket';
import { officeToken } from '@/lib/token-store';
import { findingsKey } from '../api/get-findings';

/**
 * Keeps the inbox current: a new finding or a changed job line reloads the lists; `onNew` hears each new
 * finding's id. A gap in the shop's event sequence or a reconnect reloads them too.
 */
export function useFindingsLive(onNew: (findingId: number) => void): void {
  const token = useSyncExternalStore(officeToken.subscribe, officeToken.get, officeToken.get);
  const queryClient = useQueryClient();
  const onNewRef = useRef(onNew);
  useEffect(() => {
    onNewRef.current = onNew;
  }, [onNew]);

  useEffect(() => {
    if (!token) return;
    const socket = createBoardSocket(token);
    const refresh = () => void queryClient.invalidateQueries({ queryKey: findingsKey });
    let lastSeq: number | null = null;
    let connectedBefore = false;
    socket.on('connect', () => {
      if (connectedBefore) refresh();
      connectedBefore = true;
    });
    socket.on('board.snapshot', (snapshot) => {
      lastSeq = snapshot.seq;
    });
    socket.onAny((event: string, payload?: { seq?: unknown }) => {
      const seq = payload?.seq;
      if (event === 'board.snapshot' || typeof seq !== 'number') return;
      if (lastSeq !== null && seq > lastSeq + 1) refresh();
      lastSeq = Math.max(lastSeq ?? seq, seq);
    });
    socket.on('finding.created', ({ findingId }) => {
      onNewRef.current(findingId);
      refresh();
    });
    socket.on('job-line.updated', refresh);
    socket.connect();
    return () => {
      socket.removeAllListeners();
      socket.offAny();
      socket.disconnect();
    };
  }, [token, queryClient]);
}
