import type { QueryClient } from '@tanstack/react-query';
import type { TimerDto } from '@baytime/shared';
import { timersQueryOptions } from './get-timers';

/** Puts a timer the server just answered with into the list at once, then checks with the server. */
export function storeTimer(queryClient: QueryClient, timer: TimerDto) {
  const { queryKey } = timersQueryOptions();
  queryClient.setQueryData(queryKey, (list) => {
    const others = (list ?? []).filter((t) => t.id !== timer.id);
    return timer.endedAt === null ? [...others, timer] : others;
  });
  void queryClient.invalidateQueries({ queryKey });
}
