import { useEffect } from 'react';
import { useQueryClient, type QueryKey } from '@tanstack/react-query';
import type { JobLineDto } from '@baytime/shared';
import { createBoardSocket } from '@/lib/socket';

const SETTLE_MS = 300;

/**
 * Keeps repair-order pages fresh from the shop's socket. Line changes refresh the lists and the RO they
 * belong to; punches refresh clocked time (read from the dispatch view); findings refresh findings.
 */
export function useLiveRepairOrders(token: string | null): void {
  const queryClient = useQueryClient();

  useEffect(() => {
    if (!token) return;
    const socket = createBoardSocket(token);
    const stale = new Map<string, QueryKey>();
    let timer: ReturnType<typeof setTimeout> | undefined;
    const mark = (...keys: QueryKey[]) => {
      for (const key of keys) stale.set(JSON.stringify(key), key);
      clearTimeout(timer);
      timer = setTimeout(() => {
        for (const key of stale.values()) void queryClient.invalidateQueries({ queryKey: key });
        stale.clear();
      }, SETTLE_MS);
    };
    const everything = () => mark(['repair-orders'], ['repair-order'], ['findings'], ['dispatch']);

    // The first snapshot comes with the first connect, right after the page loaded its data.
    let connectedBefore = false;
    socket.on('board.snapshot', () => {
      if (connectedBefore) everything();
      connectedBefore = true;
    });
    socket.on('job-line.updated', ({ jobLine }: { jobLine: JobLineDto }) =>
      mark(['repair-orders'], ['repair-order', jobLine.repairOrderId], ['dispatch']),
    );
    socket.on('punch.recorded', () => mark(['dispatch']));
    socket.on('bay.updated', () => mark(['dispatch']));
    socket.on('finding.created', () => mark(['findings'], ['repair-order']));
    socket.connect();
    return () => {
      clearTimeout(timer);
      socket.removeAllListeners();
      socket.disconnect();
    };
  }, [token, queryClient]);
}
