import { ForbiddenException, Inject, Injectable, UnauthorizedException } from '@nestjs/common';
import { JwtService } from '@nestjs/jwt';
import { Subject } from 'rxjs';
import { and, eq, isNull, sql } from 'drizzle-orm';
import type {
  BadgeLoginBody,
  LiveRefusalReason,
  LoginBody,
  OfficeSignInAnswer,
  PairScreenBody,
  SignInAnswer,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { screens, users, type DeviceKind } from '../db/schema/index.js';
import { hashPairingCode } from '../screens/pairing-code.js';
import { verifySecret } from './passwords.js';
import type { Principal, TokenPayload } from './principal.js';
import { SignInThrottle } from './sign-in-throttle.js';

const OFFICE_TOKEN_TTL = '12h';
/**
 * An office sign-in is renewed while in use for this long after the password was given, and the last
 * renewal's token still runs its 12 hours: a day's work, however long, never meets the sign-in page,
 * and a computer left signed in asks for the password again by the next morning.
 */
const OFFICE_RENEWALS_MS = 12 * 3_600_000;
const KIOSK_TOKEN_TTL = '2h';
/** A wall screen or kiosk stays paired until the owner revokes it. */
const DISPLAY_TOKEN_TTL = '3650d';
/** Tokens whose signature was verified, kept so a busy kiosk's every punch skips the HMAC and parsing. */
const VERIFIED_TOKENS_KEPT = 4096;

const DEVICE_ROLE = { wall: 'display', kiosk: 'kiosk' } as const satisfies Record<
  DeviceKind,
  Principal['role']
>;

/**
 * A token checked: the caller, when the token runs out (ms) and, for an office sign-in, when the
 * password was given (ms); or why it is refused.
 */
export type TokenCheck =
  { principal: Principal; expiresAt: number; signedInAt?: number } | { refusal: LiveRefusalReason };

@Injectable()
export class AuthService {
  /** A technician signed in at a kiosk with badge and PIN: their offline punches may be confirmed. */
  readonly badgeSignIns$ = new Subject<Principal>();
  /** Every request and socket asks who its token belongs to: prepared once. */
  private readonly callers;
  /** Payloads of tokens already verified, oldest first; expiry and the caller are checked on every use. */
  private readonly verified = new Map<string, TokenPayload>();

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly jwt: JwtService,
    private readonly throttle: SignInThrottle,
  ) {
    const id = sql.placeholder('id');
    this.callers = {
      screen: db.select().from(screens).where(eq(screens.id, id)).prepare(),
      user: db.select().from(users).where(eq(users.id, id)).prepare(),
    };
  }

  async login({ email, password }: LoginBody, ip: string | undefined): Promise<OfficeSignInAnswer> {
    const user = await this.throttle.check(`email:${email.toLowerCase()}`, ip, async () => {
      const row = this.db.select().from(users).where(eq(users.email, email.toLowerCase())).get();
      const ok = await verifySecret(password, row?.passwordHash ?? null);
      return row && ok && row.active && row.role !== 'technician' ? row : null;
    });
    if (!user) throw new UnauthorizedException('E-mail or password not recognised');
    return this.officeAnswer(user, Math.floor(Date.now() / 1000));
  }

  /**
   * A fresh office token of the same lifetime for the caller of `token`, checked as any request is;
   * refused once the sign-in is older than OFFICE_RENEWALS_MS (or was never an office one).
   */
  renew(token: string | undefined, now = Date.now()): OfficeSignInAnswer {
    const checked = this.check(token, now);
    if (!('principal' in checked)) throw new UnauthorizedException();
    const { principal, signedInAt } = checked;
    if (signedInAt === undefined || now - signedInAt >= OFFICE_RENEWALS_MS)
      throw new ForbiddenException('This sign-in can no longer be renewed: sign in again');
    return this.officeAnswer(principal, signedInAt / 1000);
  }

  async badge({ badge, pin }: BadgeLoginBody, ip: string | undefined): Promise<SignInAnswer> {
    const user = await this.throttle.check(`badge:${badge}`, ip, async () => {
      const row = this.db.select().from(users).where(eq(users.badge, badge)).get();
      const ok = await verifySecret(pin, row?.pinHash ?? null);
      return row && ok && row.active && row.role === 'technician' ? row : null;
    });
    if (!user) throw new UnauthorizedException('Badge or PIN not recognised');
    this.badgeSignIns$.next({ id: user.id, name: user.name, role: user.role });
    return this.answer(user, KIOSK_TOKEN_TTL);
  }

  /** A wall screen (`display` token) or a kiosk tablet (`kiosk` token) pairs once with its code. */
  pairScreen({ code }: PairScreenBody, kind: DeviceKind = 'wall'): { accessToken: string } {
    const now = new Date();
    const screen = this.db
      .select()
      .from(screens)
      .where(
        and(
          eq(screens.pairingCodeHash, hashPairingCode(code)),
          eq(screens.kind, kind),
          isNull(screens.revokedAt),
        ),
      )
      .get();
    if (!screen || !screen.pairingExpiresAt || screen.pairingExpiresAt < now)
      throw new UnauthorizedException('That pairing code is unknown or has expired');
    this.db
      .update(screens)
      .set({ pairingCodeHash: null, pairingExpiresAt: null, pairedAt: now, lastSeenAt: now })
      .where(eq(screens.id, screen.id))
      .run();
    const payload: TokenPayload = { sub: screen.id, role: DEVICE_ROLE[kind] };
    return { accessToken: this.jwt.sign(payload, { expiresIn: DISPLAY_TOKEN_TTL }) };
  }

  /** The one place a token becomes a caller, for HTTP and for the live socket alike. */
  check(token: unknown, now = Date.now()): TokenCheck {
    if (typeof token !== 'string' || token === '') return { refusal: 'token-missing' };
    let payload = this.verified.get(token);
    if (!payload) {
      try {
        // Expiry is checked below, after the caller: a revoked screen hears that it was revoked.
        payload = this.jwt.verify<TokenPayload>(token, { ignoreExpiration: true });
      } catch {
        return { refusal: 'token-invalid' };
      }
      if (this.verified.size >= VERIFIED_TOKENS_KEPT)
        this.verified.delete(this.verified.keys().next().value!);
      this.verified.set(token, payload);
    }
    return this.checkPayload(payload, now);
  }

  /** For a payload whose signature was already verified. */
  checkPayload(payload: TokenPayload, now = Date.now()): TokenCheck {
    const caller = this.callerOf(payload);
    if (typeof caller === 'string') return { refusal: caller };
    if (typeof payload.exp !== 'number') return { refusal: 'token-no-expiry' };
    if (payload.exp * 1000 <= now) return { refusal: 'token-expired' };
    const signedInAt = payload.signedInAt === undefined ? undefined : payload.signedInAt * 1000;
    return { principal: caller, expiresAt: payload.exp * 1000, signedInAt };
  }

  private callerOf(payload: TokenPayload): Principal | LiveRefusalReason {
    if (payload.role === 'display' || payload.role === 'kiosk') {
      const screen = this.callers.screen.get({ id: payload.sub });
      if (!screen || screen.revokedAt || !screen.pairedAt || DEVICE_ROLE[screen.kind] !== payload.role)
        return 'screen-revoked';
      return { id: screen.id, name: screen.name, role: payload.role };
    }
    const user = this.callers.user.get({ id: payload.sub });
    if (!user || !user.active) return 'account-inactive';
    if (user.role !== payload.role) return 'role-changed';
    // Signed in before the password or PIN changed (to the second a token knows its time by).
    const signedIn = payload.signedInAt ?? payload.iat ?? 0;
    if (user.credentialsChangedAt && signedIn < Math.floor(user.credentialsChangedAt.getTime() / 1000))
      return 'credentials-changed';
    return { id: user.id, name: user.name, role: user.role };
  }

  /** `signedInAt` in seconds since the epoch, as tokens carry it. */
  private officeAnswer(user: Principal, signedInAt: number): OfficeSignInAnswer {
    const renewableUntil = new Date(signedInAt * 1000 + OFFICE_RENEWALS_MS).toISOString();
    return { ...this.answer(user, OFFICE_TOKEN_TTL, signedInAt), renewableUntil };
  }

  private answer(
    user: { id: number; name: string; role: Principal['role'] },
    expiresIn: string,
    signedInAt?: number,
  ): SignInAnswer {
    const payload: TokenPayload = { sub: user.id, role: user.role, signedInAt };
    return {
      accessToken: this.jwt.sign(payload, { expiresIn: expiresIn as '1h' }),
      user: { id: user.id, name: user.name, role: user.role },
    };
  }
}
