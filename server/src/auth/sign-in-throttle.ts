import { Inject, Injectable } from '@nestjs/common';
import { eq, lt } from 'drizzle-orm';
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
/**
 * An address's wrong tries count within a window of this length from its first try: a tablet that ten
 * people use all day gathers a few slips, which must not add up to a lock for everyone by the afternoon.
 */
const ADDRESS_WINDOW_MS = 15 * 60_000;

type Row = typeof signInThrottles.$inferSelect;

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
 *
 * A try is counted before its secret is checked, and only as many tries as the key has left are
 * checked at once; the others wait for those to settle. So 40 wrong PINs at once reach the hash 5
 * times, and 6 right passwords at once all get in (the first success clears the count).
 */
@Injectable()
export class SignInThrottle {
  private lastPrunedAt = 0;
  private readonly inFlight = new Map<string, number>();
  private waiting: (() => void)[] = [];

  constructor(
    @Inject(DB) private readonly db: Db,
    private readonly uow: UnitOfWork,
  ) {}

  /**
   * Runs `verify` as one counted try on the account and the client's address; it gives the caller
   * or null for a wrong secret. Throws 429 with the wait while either key is locked.
   */
  async check<T>(
    account: string,
    rawAddress: string | undefined,
    verify: () => Promise<T | null>,
  ): Promise<T | null> {
    const keys = new Map([
      [account, ACCOUNT_LIMIT],
      [addressKey(rawAddress), ADDRESS_LIMIT],
    ]);
    for (;;) {
      const admitted = this.admit(keys, Date.now());
      if (typeof admitted === 'number') throw tooManyTries(admitted);
      if (admitted) break;
      await new Promise<void>((resolve) => this.waiting.push(resolve));
    }
    let caller: T | null = null;
    try {
      caller = await verify();
      return caller;
    } finally {
      this.settle(keys, caller !== null, Date.now());
    }
  }

  /**
   * Counts the try (true), or says to wait for the tries in flight (false), or how long the key
   * is locked for (ms).
   */
  private admit(keys: Map<string, number>, now: number): boolean | number {
    return this.uow.run(() => {
      this.prune(now);
      const rows = new Map([...keys.keys()].map((key) => [key, this.row(key, now)]));
      const lockedUntil = Math.max(0, ...[...rows.values()].map((row) => row?.lockedUntil?.getTime() ?? 0));
      if (lockedUntil > now) return lockedUntil - now;
      for (const [key, limit] of keys) {
        const row = rows.get(key);
        if (!row || row.failures < limit) continue;
        if (this.inFlight.get(key)) return false;
        // The tries that reached the limit are all known to be wrong: lock now.
        return this.lock(key, row, now) - now;
      }
      for (const key of keys.keys()) {
        const row = rows.get(key);
        this.inFlight.set(key, (this.inFlight.get(key) ?? 0) + 1);
        // An address's row keeps the time its window began.
        this.write(key, {
          ...this.fresh(row, now),
          failures: (row?.failures ?? 0) + 1,
          ...(isAddress(key) && row && { lastAttemptAt: row.lastAttemptAt }),
        });
      }
      return true;
    });
  }

  private settle(keys: Map<string, number>, succeeded: boolean, now: number): void {
    const [account, address] = [...keys.keys()] as [string, string];
    for (const key of keys.keys()) {
      const left = (this.inFlight.get(key) ?? 1) - 1;
      if (left > 0) this.inFlight.set(key, left);
      else this.inFlight.delete(key);
    }
    this.uow.run(() => {
      if (succeeded) {
        this.db.delete(signInThrottles).where(eq(signInThrottles.key, account)).run();
        const row = this.row(address, now);
        if (row && row.failures > 0) this.write(address, { ...row, failures: row.failures - 1 });
        return;
      }
      for (const [key, limit] of keys) {
        const row = this.row(key, now);
        if (row && row.failures >= limit && !this.inFlight.get(key)) this.lock(key, row, now);
      }
    });
    const waiting = this.waiting;
    this.waiting = [];
    for (const resolve of waiting) resolve();
  }

  /** Locks the key for its next step and returns when the lock lifts. */
  private lock(key: string, row: Row, now: number): number {
    const lockedUntil = now + lockMs(row.lockStep);
    this.write(key, {
      failures: 0,
      lockStep: row.lockStep + 1,
      lockedUntil: new Date(lockedUntil),
      lastAttemptAt: new Date(now),
    });
    return lockedUntil;
  }

  /**
   * The key's row, or none once it has been quiet for a day. An address whose window has passed starts a
   * new one now, its wrong tries forgotten and its lock step kept.
   */
  private row(key: string, now: number): Row | undefined {
    const row = this.db.select().from(signInThrottles).where(eq(signInThrottles.key, key)).get();
    if (!row || now - row.lastAttemptAt.getTime() > QUIET_RESET_MS) return undefined;
    if (isAddress(key) && now - row.lastAttemptAt.getTime() > ADDRESS_WINDOW_MS)
      return { ...row, failures: 0, lastAttemptAt: new Date(now) };
    return row;
  }

  private fresh(row: Row | undefined, now: number): Omit<Row, 'key'> {
    return {
      failures: row?.failures ?? 0,
      lockStep: row?.lockStep ?? 0,
      lockedUntil: null,
      lastAttemptAt: new Date(now),
    };
  }

  private write(key: string, values: Omit<Row, 'key'>): void {
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

const ADDRESS_PREFIX = 'ip:';
const addressKey = (raw: string | undefined) => `${ADDRESS_PREFIX}${clientAddressKey(raw)}`;
const isAddress = (key: string) => key.startsWith(ADDRESS_PREFIX);

function tooManyTries(waitMs: number): RetryLaterException {
  return new RetryLaterException(
    `Too many wrong tries. Try again in ${waitWords(waitMs)}.`,
    Math.ceil(waitMs / 1000),
  );
}

function lockMs(step: number): number {
  return Math.min(LONGEST_LOCK_MS, FIRST_LOCK_MS * 2 ** Math.min(step, 20));
}
