import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { OfflinePunchDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { offlinePunchesKey } from './get-offline-punches';

export type Decision = 'confirm' | 'reject';

/** `POST /api/offline-punches/:id/confirm` makes it a punch; `…/reject` throws it out. */
export function decideOfflinePunch(id: string, decision: Decision): Promise<OfflinePunchDto> {
  return officeApi.post<OfflinePunchDto>(`/offline-punches/${id}/${decision}`);
}

export function useDecideOfflinePunch() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, decision }: { id: string; decision: Decision }) => decideOfflinePunch(id, decision),
    onSettled: () => queryClient.invalidateQueries({ queryKey: offlinePunchesKey }),
  });
}
