import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TimerDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { storeTimer } from './timer-cache';

/** `POST /api/timers/:id/stop`. */
export const stopTimer = (timerId: number) =>
  sendCommand(() => api.post<TimerDto>(`/timers/${timerId}/stop`));

export function useStopTimer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: stopTimer,
    retry: false,
    onSuccess: (timer) => storeTimer(queryClient, timer),
  });
}
