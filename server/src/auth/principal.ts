import type { Role } from '@baytime/shared';

/**
 * Who is calling: a person, or a paired device: a wall screen (role `display`) or a kiosk tablet (role
 * `kiosk`), whose id is the device's row in `screens`.
 */
export interface Principal {
  id: number;
  name: string;
  role: Role;
  /** Set when another system calls with an integration key; `id` is then the owner who made the key. */
  integrationKey?: { id: number; name: string };
}

export interface TokenPayload {
  sub: number;
  role: Role;
  /** Seconds since the epoch; every token this server signs has one, and one without is refused. */
  exp?: number;
  /** An office token's: when the password was given (seconds since the epoch), kept by its renewals. */
  signedInAt?: number;
  /** When it was signed (seconds since the epoch); the signer adds it. */
  iat?: number;
}
