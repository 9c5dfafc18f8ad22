import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { StartTimerBody, TimerDto } from '@baytime/shared';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { storeTimer } from './timer-cache';

/** `POST /api/timers`: warm-up and cool-down need a target and the acknowledged caution. */
export const startTimer = (body: StartTimerBody) => sendCommand(() => api.post<TimerDto>('/timers', body));

export function useStartTimer() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: startTimer,
    retry: false,
    onSuccess: (timer) => storeTimer(queryClient, timer),
  });
}
