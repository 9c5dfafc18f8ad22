import { z } from 'zod';
import { badgeLoginSchema } from '../auth/auth.schema.js';
import { instantSchema } from '../input/fields.js';
import { pageQuerySchema } from '../paging/page.schema.js';
import { BREAK_KINDS, type BreakKind } from './punches.schema.js';
import { OFFLINE_PUNCH_KINDS, type OfflineIdentity, type OfflinePunchKind } from './offline-identity.js';

export {
  identityText,
  OFFLINE_PUNCH_KINDS,
  type OfflineIdentity,
  type OfflinePunchKind,
} from './offline-identity.js';

/**
 * `unverified`: the PIN matched but the technician has not confirmed it yet (next sign-in online, or
 * the foreman); `refused`: the identity did not check out (wrong PIN, unknown badge); `confirmed`: it
 * is a punch now; `rejected`: the foreman threw it out.
 */
export const OFFLINE_PUNCH_STATUSES = ['unverified', 'refused', 'confirmed', 'rejected'] as const;
export type OfflinePunchStatus = (typeof OFFLINE_PUNCH_STATUSES)[number];

/** The identity read back from its text, or null when it is not one. */
export function readIdentityText(text: string): OfflineIdentity | null {
  try {
    const parsed: unknown = JSON.parse(text);
    if (!Array.isArray(parsed) || parsed.length !== 5 || !parsed.every((part) => typeof part === 'string'))
      return null;
    const [badge, pin, id, kind, at] = parsed as string[];
    if (!badgeLoginSchema.safeParse({ badge, pin }).success) return null;
    if (!(OFFLINE_PUNCH_KINDS as readonly string[]).includes(kind!)) return null;
    return { badge: badge!, pin: pin!, id: id!, kind: kind as OfflinePunchKind, at: at! };
  } catch {
    return null;
  }
}

/** `POST /api/kiosks/me/offline-punches`: one punch, its identity sealed to the server's key. */
export const offlinePunchSchema = z
  .object({
    id: z.uuid(),
    kind: z.enum(OFFLINE_PUNCH_KINDS),
    at: instantSchema,
    breakKind: z.enum(BREAK_KINDS).optional(),
    keyId: z.string().regex(/^[0-9a-f]{16}$/, 'Not a key id'),
    /** RSA-OAEP (SHA-256) ciphertext of `identityText`, base64. */
    identity: z
      .string()
      .max(1024)
      .regex(/^[A-Za-z0-9+/]+={0,2}$/, 'Not base64'),
  })
  .strict();
export type OfflinePunchBody = z.infer<typeof offlinePunchSchema>;

/** The server's public key for sealing identities: `GET /api/kiosks/me/offline-key`. */
export interface OfflineKeyDto {
  keyId: string;
  /** An RSA-OAEP-256 public key as a JSON Web Key. */
  publicKey: Record<string, unknown>;
}

/** `POST /api/kiosks/me/queue`: how many punches wait on this tablet, and since when. */
export const kioskQueueSchema = z
  .object({
    waiting: z.number().int().min(0).max(1_000_000),
    oldestQueuedAt: instantSchema.nullable(),
  })
  .strict();
export type KioskQueueBody = z.infer<typeof kioskQueueSchema>;

/** An offline punch as the foreman sees it: `GET /api/offline-punches`. */
export interface OfflinePunchDto {
  id: string;
  kioskName: string;
  badge: string | null;
  technicianId: number | null;
  technicianName: string | null;
  kind: OfflinePunchKind;
  breakKind: BreakKind | null;
  at: string;
  status: OfflinePunchStatus;
  problem: string | null;
  receivedAt: string;
  decidedAt: string | null;
}

/** `GET /api/offline-punches?status=&limit=&cursor=`, newest tapped first. */
export const offlinePunchListSchema = pageQuerySchema.extend({
  status: z.enum(OFFLINE_PUNCH_STATUSES).optional(),
});
export type OfflinePunchListQuery = z.infer<typeof offlinePunchListSchema>;

/** A paired kiosk tablet in Admin → Kiosks, with what its outbox last said. */
export interface KioskDto {
  id: number;
  name: string;
  pairedAt: string | null;
  lastSeenAt: string | null;
  revokedAt: string | null;
  pairingExpiresAt: string | null;
  queue: { waiting: number; since: string | null; reportedAt: string | null };
}

/** On the wall's top bar: punches waiting on a kiosk that cannot send them. */
export interface KioskQueueNote {
  kioskId: number;
  name: string;
  waiting: number;
  since: string | null;
}
