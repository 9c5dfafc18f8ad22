import { Inject, Injectable } from '@nestjs/common';
import { eq, inArray, lt } from 'drizzle-orm';
import { RetryLaterException } from '../common/retry-later.exception.js';
import { DB, type Db } from '../db/database.js';
import { UnitOfWork } from '../db/unit-of-work.js';
import { signInThrottles } from '../db/schema/index.js';
import { clientAddressKey } from './client-address.js';

/** Wrong tries on one badge or e-mail before it locks: a 4-digit PIN then takes days to guess. */
export const ACCOUNT_LIMIT = 5;
/** A shared tablet or office PC serves many people: its address gets more room. */
export const ADDRESS_LIMIT = 20;
const FIRST_LOCK_MS = 60_000;
const LONGEST_LOCK_MS = 60 * 60_000;
/** A key with no attempt for this long starts afresh. */
const QUIET_RESET_MS = 24 * 60 * 60_000;

type Row = typeof signInThrottles.$inferSelect;

export interface SignInAttempt {
  /** The secret was right: the account starts afresh and the try does not count against the address. */
  succeeded: () => void;
}

/** "45 seconds", "1 minute", "8 minutes", "1 hour". */
export function waitWords(ms: number): string {
  const seconds = Math.max(1, Math.ceil(ms / 1000));
  if (seconds < 60) return seconds === 1 ? '1 second' : `${seconds} seconds`;
  const minutes = Math.ceil(seconds / 60);
  if (minutes < 60) return minutes === 1 ? '1 minute' : `${minutes} minutes`;
  const hours = Math.ceil(minutes / 60);
  return hours === 1 ? '1 hour' : `${hours} hours`;
}

/**
 * Throttles sign-in per account and per client address, in SQLite so a restart does not lift a
 * lock. Each lock lasts twice the one before (1, 2, 4 … 60 minutes): a few wrong tries by the
 * real person cost a minute, and guessing costs ever more.
 */
@Injectable()
export class SignInThrottle {
  private lastPrunedAt = 0;

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
  ) {}

  /**
   * Counts one try on the account and the address, before the secret is checked; throws 429 with
   * the wait while either is locked. Synchronous, so concurrent tries are counted one by one.
   */
  attempt(account: string, rawAddress: string | undefined, now = Date.now()): SignInAttempt {
    const address = `ip:${clientAddressKey(rawAddress)}`;
    const limits = new Map([
      [account, ACCOUNT_LIMIT],
      [address, ADDRESS_LIMIT],
    ]);
    this.uow.run(() => {
      this.prune(now);
      const rows = this.db
        .select()
        .from(signInThrottles)
        .where(inArray(signInThrottles.key, [...limits.keys()]))
        .all()
        .map((row) => (now - row.lastAttemptAt.getTime() > QUIET_RESET_MS ? null : row));
      const lockedUntil = Math.max(0, ...rows.map((row) => row?.lockedUntil?.getTime() ?? 0));
      if (lockedUntil > now) {
        const wait = lockedUntil - now;
        throw new RetryLaterException(
          `Too many wrong tries. Try again in ${waitWords(wait)}.`,
          Math.ceil(wait / 1000),
        );
      }
      for (const [key, limit] of limits)
        this.count(
          key,
          limit,
          rows.find((row) => row?.key === key),
          now,
        );
    });
    return {
      succeeded: () =>
        this.uow.run(() => {
          this.db.delete(signInThrottles).where(eq(signInThrottles.key, account)).run();
          const row = this.db.select().from(signInThrottles).where(eq(signInThrottles.key, address)).get();
          if (row && row.failures > 0)
            this.db
              .update(signInThrottles)
              .set({ failures: row.failures - 1 })
              .where(eq(signInThrottles.key, address))
              .run();
        }),
    };
  }

  /** The try that reaches the limit is still checked; the lock holds the ones after it. */
  private count(key: string, limit: number, row: Row | null | undefined, now: number): void {
    const failures = (row?.failures ?? 0) + 1;
    const lockStep = row?.lockStep ?? 0;
    const locks = failures >= limit;
    const values = {
      failures: locks ? 0 : failures,
      lockStep: locks ? lockStep + 1 : lockStep,
      lockedUntil: locks ? new Date(now + lockMs(lockStep)) : null,
      lastAttemptAt: new Date(now),
    };
    this.db
      .insert(signInThrottles)
      .values({ key, ...values })
      .onConflictDoUpdate({ target: signInThrottles.key, set: values })
      .run();
  }

  /** Keys nobody tried for a day say nothing any more; drop them now and then. */
  private prune(now: number): void {
    if (now - this.lastPrunedAt < 60_000) return;
    this.lastPrunedAt = now;
    this.db
      .delete(signInThrottles)
      .where(lt(signInThrottles.lastAttemptAt, new Date(now - QUIET_RESET_MS)))
      .run();
  }
}

function lockMs(step: number): number {
  return Math.min(LONGEST_LOCK_MS, FIRST_LOCK_MS * 2 ** Math.min(step, 20));
}
