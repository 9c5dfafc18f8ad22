import { useCallback, useEffect, useRef } from 'react';
import { useQueryClient, type QueryKey } from '@tanstack/react-query';
import { useOfficeLive, type LiveListener } from '@/lib/socket';
import { repairOrdersKey } from '../api/get-repair-orders';

const SETTLE_MS = 300;

/**
 * Keeps repair-order pages fresh from the shop's socket, a burst of changes at a time. Line changes mark
 * the list pages stale and refresh the RO they belong to; only the list page on screen is fetched again,
 * the others when they are shown. Punches refresh clocked time (read from the dispatch view); findings
 * refresh findings.
 */
export function useLiveRepairOrders(token: string | null): void {
  const queryClient = useQueryClient();
  const stale = useRef(new Map<string, QueryKey>());
  const timer = useRef<ReturnType<typeof setTimeout> | undefined>(undefined);
  useEffect(() => () => clearTimeout(timer.current), []);

  const mark = useCallback(
    (...keys: QueryKey[]) => {
      for (const key of keys) stale.current.set(JSON.stringify(key), key);
      clearTimeout(timer.current);
      timer.current = setTimeout(() => {
        for (const key of stale.current.values())
          void queryClient.invalidateQueries({ queryKey: key, refetchType: 'active' });
        stale.current.clear();
      }, SETTLE_MS);
    },
    [queryClient],
  );
  const everything = useCallback(
    () => mark(repairOrdersKey, ['repair-order'], ['repair-order-history'], ['findings'], ['dispatch']),
    [mark],
  );
  const wire = useCallback(
    (socket: LiveListener) => {
      socket.on('job-line.updated', ({ jobLine }) =>
        mark(
          repairOrdersKey,
          ['repair-order', jobLine.repairOrderId],
          ['repair-order-history', jobLine.repairOrderId],
          ['dispatch'],
        ),
      );
      socket.on('punch.recorded', () => mark(['dispatch']));
      socket.on('bay.updated', () => mark(['dispatch']));
      socket.on('finding.created', () => mark(['findings'], ['repair-order']));
      socket.on('finding.answered', () => mark(['findings'], ['repair-order']));
      socket.on('repair-order.updated', ({ repairOrderId }) =>
        mark(repairOrdersKey, ['repair-order', repairOrderId], ['repair-order-history', repairOrderId]),
      );
    },
    [mark],
  );
  useOfficeLive(token, wire, everything);
}
