import type { HeldPunchDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { useResolution } from './resolve';

/** `POST /api/punches/held/:id/reject`: it stays on record, never counted. */
export function rejectHeldPunch({ id, reason }: { id: string; reason: string }): Promise<HeldPunchDto> {
  return officeApi.post<HeldPunchDto>(`/punches/held/${encodeURIComponent(id)}/reject`, { reason });
}

export const useRejectHeldPunch = () => useResolution(rejectHeldPunch);
