import type { Role } from '@baytime/shared';

/**
 * Who is calling: a person, or a paired device: a wall screen (role `display`) or a kiosk tablet (role
 * `kiosk`), whose id is the device's row in `screens`.
 */
export interface Principal {
  id: number;
  name: string;
  role: Role;
}

export interface TokenPayload {
  sub: number;
  role: Role;
  /** Seconds since the epoch; every token this server signs has one, and one without is refused. */
  exp?: number;
}
