import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { TimerDto, TimerReadingBody } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { storeTimer } from './timer-cache';

/** `POST /api/timers/:id/readings` → the timer with its new estimate. */
export const logReading = ({ timerId, ...body }: TimerReadingBody & { timerId: number }) =>
  sendCommand(() => api.post<TimerDto>(`/timers/${timerId}/readings`, body));

export function useLogReading() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: logReading,
    retry: false,
    onSuccess: (timer) => storeTimer(queryClient, timer),
  });
}
