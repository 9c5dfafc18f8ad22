import { ApiError } from '@baytime/shared/client';
import type { TokenStore } from '@/lib/token-store';
import type { OfficeSignInAnswer } from '@baytime/shared';
import type { SignInRecords } from './sign-in-end';

/** A token is renewed once less than this share of its life is left: 4 of an office token's 12 hours. */
const RENEW_IN_LAST = 1 / 3;
/** After a renewal that did not go through (no connection, a busy server) the token is left this long. */
export const RETRY_AFTER_MS = 5 * 60_000;

/** When a token was signed and when it runs out (ms), as the token itself says. */
export interface TokenLife {
  issuedAt: number;
  expiresAt: number;
  /** An office token's: when the password was given (ms), the same in all its renewals. */
  signedInAt?: number;
}

/** The times a signed token carries in its payload; null for anything else. */
export function tokenLife(token: string): TokenLife | null {
  try {
    const payload = (token.split('.')[1] ?? '').replace(/-/g, '+').replace(/_/g, '/');
    const { iat, exp, signedInAt } = JSON.parse(atob(payload)) as Record<string, unknown>;
    if (typeof iat !== 'number' || typeof exp !== 'number' || exp <= iat) return null;
    const life: TokenLife = { issuedAt: iat * 1000, expiresAt: exp * 1000 };
    if (typeof signedInAt === 'number') life.signedInAt = signedInAt * 1000;
    return life;
  } catch {
    return null;
  }
}

/**
 * Whether to ask for a fresh token now: in the last third of its life, not yet run out, and not before
 * `retryAt` (ms), the wait after a failed try.
 */
export function renewalDue(life: TokenLife, now: number, retryAt = 0): boolean {
  const left = life.expiresAt - now;
  return left > 0 && left < (life.expiresAt - life.issuedAt) * RENEW_IN_LAST && now >= retryAt;
}

export interface SignInRenewer {
  /** Renews the stored token if it is due; a failure leaves the token as it was. */
  renewIfDue(): void;
}

export function createSignInRenewer({
  tokens,
  records,
  renew,
  now = Date.now,
}: {
  tokens: Pick<TokenStore, 'get' | 'set'>;
  /** Until when the sign-in is renewed: told by each answer and a refusal, and asked before trying. */
  records: Pick<SignInRecords, 'of' | 'answered' | 'refused'>;
  renew: () => Promise<OfficeSignInAnswer>;
  now?: () => number;
}): SignInRenewer {
  let renewing = false;
  let wait: { token: string; retryAt: number } | null = null;
  return {
    renewIfDue() {
      const token = tokens.get();
      const life = token ? tokenLife(token) : null;
      if (renewing || !token || !life) return;
      if (!renewalDue(life, now(), wait?.token === token ? wait.retryAt : 0)) return;
      // Past the end of renewals the answer is known: a refusal.
      if (now() >= (records.of(token)?.renewableUntil ?? Number.POSITIVE_INFINITY)) return;
      renewing = true;
      renew()
        .then(
          (answer) => {
            // Signed out, or in as someone else, while the answer was on its way: that sign-in stands.
            if (tokens.get() !== token) return;
            records.answered(answer.accessToken, answer);
            tokens.set(answer.accessToken);
          },
          (error: unknown) => {
            // A refusal (the sign-in is too old to renew) stands until the token runs out.
            const refused = error instanceof ApiError && error.status === 403;
            wait = { token, retryAt: refused ? Number.POSITIVE_INFINITY : now() + RETRY_AFTER_MS };
            if (refused) records.refused(token, now());
          },
        )
        .finally(() => {
          renewing = false;
        });
    },
  };
}
