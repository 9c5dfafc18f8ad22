import { useCallback } from 'react';
import type { BreakKind, PunchKind } from '@baytime/shared';
import { useSession } from '@/lib/session';
import type { NewOutboxEntry } from '../outbox';
import { kick, outbox, pushNotice, tellOtherTabs } from '../punch-queue';
import { newPunchId } from '../punch-id';

export interface PunchRequest {
  kind: PunchKind;
  jobLineId?: number;
  breakKind?: BreakKind;
  /** What the technician tapped, in words: "Clock on RO 4417 line 2". */
  label: string;
}

/**
 * Queues punches for the signed-in technician: written to the tablet's outbox first, then sent.
 * Several requests from one tap (clock off every line, then start a break) keep their order and
 * get timestamps one millisecond apart.
 */
export function usePunch(): (requests: readonly PunchRequest[]) => Promise<boolean> {
  const current = useSession();
  return useCallback(
    async (requests) => {
      if (!current || requests.length === 0) return false;
      const now = Date.now();
      const entries = requests.map<NewOutboxEntry>((request, i) => ({
        punch: {
          id: newPunchId(),
          kind: request.kind,
          at: new Date(now + i).toISOString(),
          ...(request.jobLineId !== undefined && { jobLineId: request.jobLineId }),
          ...(request.breakKind !== undefined && { breakKind: request.breakKind }),
        },
        token: current.accessToken,
        technicianId: current.user.id,
        technicianName: current.user.name,
        label: request.label,
      }));
      try {
        await outbox.add(entries, now);
      } catch {
        pushNotice({
          id: entries[0]!.punch.id,
          technicianId: current.user.id,
          technicianName: current.user.name,
          label: requests.map((r) => r.label).join(', '),
          message: 'This tablet could not save it (its storage is full or blocked). Tell the foreman.',
        });
        return false;
      }
      tellOtherTabs();
      void kick();
      return true;
    },
    [current],
  );
}
