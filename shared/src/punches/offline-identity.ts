// Kept out of the zod schemas: the kiosk seals an identity before anyone signs in.
/** What a technician may record at a kiosk that cannot reach the server: shift and break punches. */
export const OFFLINE_PUNCH_KINDS = ['shift-in', 'shift-out', 'break-start', 'break-end'] as const;
export type OfflinePunchKind = (typeof OFFLINE_PUNCH_KINDS)[number];

/** The badge and PIN typed for one offline punch, bound to that punch, before sealing. */
export interface OfflineIdentity {
  badge: string;
  pin: string;
  id: string;
  kind: OfflinePunchKind;
  at: string;
}

/** The text sealed to the server's key; short, for RSA-OAEP with SHA-256 takes at most 190 bytes. */
export function identityText({ badge, pin, id, kind, at }: OfflineIdentity): string {
  return JSON.stringify([badge, pin, id, kind, at]);
}
