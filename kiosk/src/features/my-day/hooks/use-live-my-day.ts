import { useEffect } from 'react';
import { useQueryClient } from '@tanstack/react-query';
import { onLive } from '@/lib/socket';
import { myDayRootKey } from '../api/get-my-day';

/**
 * Refetches my-day when the floor changes under the technician: a punch of theirs (from this or
 * another tablet, or a foreman's correction), a line assigned to them or taken away, or a fresh
 * snapshot after a reconnect.
 */
export function useLiveMyDay(technicianId: number, myLineIds: readonly number[]) {
  const queryClient = useQueryClient();
  const lineKey = myLineIds.join(',');

  useEffect(() => {
    const mine = new Set(lineKey ? lineKey.split(',').map(Number) : []);
    const refresh = () => void queryClient.invalidateQueries({ queryKey: myDayRootKey });
    const offs = [
      onLive('board.snapshot', refresh),
      onLive('punch.recorded', ({ punch }) => {
        if (punch.technicianId === technicianId || (punch.jobLineId !== null && mine.has(punch.jobLineId)))
          refresh();
      }),
      onLive('job-line.updated', ({ jobLine }) => {
        if (jobLine.technicianId === technicianId || mine.has(jobLine.id)) refresh();
      }),
    ];
    return () => offs.forEach((off) => off());
  }, [queryClient, technicianId, lineKey]);
}
