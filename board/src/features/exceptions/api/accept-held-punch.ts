import type { HeldPunchDto } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';
import { useResolution } from './resolve';

/** `POST /api/punches/held/:id/accept`: the punch counts; what it displaces is voided, audited. */
export function acceptHeldPunch({ id, reason }: { id: string; reason: string }): Promise<HeldPunchDto> {
  return officeApi.post<HeldPunchDto>(`/punches/held/${encodeURIComponent(id)}/accept`, { reason });
}

export const useAcceptHeldPunch = () => useResolution(acceptHeldPunch);
