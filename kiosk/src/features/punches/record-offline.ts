import type { BreakKind, OfflinePunchKind } from '@baytime/shared';
import { device } from '@/lib/device';
import { storedOfflineKey } from './api/get-offline-key';
import { newPunchId } from './punch-id';
import { kick, outbox, tellOtherTabs } from './punch-queue';
import { sealIdentity } from './seal';

export const NO_KEY_YET =
  'This tablet has not been online since it was paired, so it cannot record punches offline yet. Tell the foreman.';

export interface OfflinePunchRequest {
  badge: string;
  pin: string;
  kind: OfflinePunchKind;
  breakKind?: BreakKind;
  /** What was tapped, in words. */
  label: string;
}

/**
 * Queues a shift or break punch typed at a kiosk that cannot reach the server: the tapped time is
 * taken first, then badge and PIN are sealed to the server's key and the PIN is dropped. The server
 * keeps it as "identity not yet verified" until the technician signs in online or the foreman confirms.
 */
export async function recordOfflinePunch({
  badge,
  pin,
  kind,
  breakKind,
  label,
}: OfflinePunchRequest): Promise<string> {
  const now = Date.now();
  const at = new Date(now).toISOString();
  const key = storedOfflineKey();
  const token = device.token();
  if (!key || !token) throw new Error(NO_KEY_YET);
  const id = newPunchId();
  const identity = await sealIdentity(key, { badge, pin, id, kind, at });
  await outbox.add(
    [
      {
        punch: { id, kind, at, ...(breakKind && { breakKind }), sealed: { keyId: key.keyId, identity } },
        token,
        technicianId: -Number(badge),
        technicianName: `Badge ${badge}`,
        label,
      },
    ],
    now,
  );
  tellOtherTabs();
  void kick();
  return at;
}
