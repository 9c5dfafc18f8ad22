import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  createSignInEndWatch,
  createSignInRecords,
  NOTICE_BEFORE_MS,
  RECHECK_MS,
  signInEnd,
} from './sign-in-end';

const MINUTE = 60_000;
const HOUR = 3_600_000;
/** The password was given at 7:00 in the shop (Chicago); renewals end 12 hours later. */
const SIGNED = Date.UTC(2026, 2, 9, 12, 0);
const UNTIL = SIGNED + 12 * HOUR;

/** An office token as the server signs them (the signature is not read here), base64url without padding. */
function token(issuedAt: number, signedInAt = SIGNED): string {
  const part = (value: object) =>
    btoa(JSON.stringify(value)).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
  const payload = { sub: 3, role: 'advisor', signedInAt: signedInAt / 1000, iat: issuedAt / 1000 };
  return `${part({ alg: 'HS256' })}.${part({ ...payload, exp: issuedAt / 1000 + 12 * 3600 })}.signature`;
}

/** A string kept in memory with listeners, as the office's localStorage stores are. */
function memoryStore(value: string | null = null) {
  const listeners = new Set<() => void>();
  const write = (next: string | null) => {
    value = next;
    for (const listener of listeners) listener();
  };
  return {
    key: 'memory',
    get: () => value,
    set: (next: string) => write(next),
    clear: () => write(null),
    subscribe: (listener: () => void) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
  };
}

const answer = (until = UNTIL) => ({ renewableUntil: new Date(until).toISOString() });

describe(createSignInRecords.name, () => {
  it('keeps what the answers said for their sign-in, and the e-mail given for it', () => {
    const sut = createSignInRecords(memoryStore());
    const first = token(SIGNED);
    sut.answered(first, answer(), 'advisor@marlowcreek.test');
    const renewed = token(SIGNED + 8 * HOUR);
    sut.answered(renewed, answer());
    expect(sut.of(renewed)).toEqual({
      signedInAt: SIGNED,
      renewableUntil: UNTIL,
      email: 'advisor@marlowcreek.test',
    });
    expect(sut.of(first)).toEqual(sut.of(renewed));
    // Another sign-in's token, a token of no sign-in, or none: nothing is known of them.
    expect(sut.of(token(SIGNED + HOUR, SIGNED + HOUR))).toBeNull();
    expect(sut.of('not-a-token')).toBeNull();
    expect(sut.of(null)).toBeNull();
  });

  it('takes a refusal as the end of renewals, never later than the answers said', () => {
    const sut = createSignInRecords(memoryStore());
    const last = token(SIGNED + 8 * HOUR);
    sut.refused(last, SIGNED + 16 * HOUR);
    expect(sut.of(last)?.renewableUntil).toBe(SIGNED + 16 * HOUR);
    sut.answered(last, answer());
    sut.refused(last, SIGNED + 16 * HOUR);
    expect(sut.of(last)?.renewableUntil).toBe(UNTIL);
  });

  it('reads nothing from a stored value it cannot use', () => {
    for (const stored of ['', '{', '[]', 'null', '{"signedInAt":"yesterday"}'])
      expect(createSignInRecords(memoryStore(stored)).of(token(SIGNED)), stored).toBeNull();
  });
});

describe(signInEnd.name, () => {
  const life = (issuedAt: number) => ({ issuedAt, expiresAt: issuedAt + 12 * HOUR, signedInAt: SIGNED });

  it('is null while the token can be renewed, or while nothing says until when', () => {
    expect(signInEnd(life(SIGNED), { signedInAt: SIGNED, renewableUntil: UNTIL })).toBeNull();
    expect(signInEnd(life(SIGNED + 8 * HOUR), { signedInAt: SIGNED })).toBeNull();
    expect(signInEnd(life(SIGNED + 8 * HOUR), null)).toBeNull();
  });

  it('warns before the last token runs out, and not before renewals end', () => {
    expect(signInEnd(life(SIGNED + 8 * HOUR), { signedInAt: SIGNED, renewableUntil: UNTIL })).toEqual({
      noticeAt: SIGNED + 20 * HOUR - NOTICE_BEFORE_MS,
      endsAt: SIGNED + 20 * HOUR,
    });
    const refusedLate = SIGNED + 20 * HOUR - 3 * MINUTE;
    expect(signInEnd(life(SIGNED + 8 * HOUR), { signedInAt: SIGNED, renewableUntil: refusedLate })).toEqual({
      noticeAt: refusedLate,
      endsAt: SIGNED + 20 * HOUR,
    });
  });
});

describe(createSignInEndWatch.name, () => {
  beforeEach(() => vi.useFakeTimers());
  afterEach(() => vi.useRealTimers());

  /** The office at `at`, holding `held`, its sign-in's answers having said `said`. */
  function setUp(at: number, held: string, said: { renewableUntil?: string } = answer()) {
    vi.setSystemTime(at);
    const tokens = memoryStore(held);
    const records = createSignInRecords(memoryStore());
    records.answered(held, said, 'advisor@marlowcreek.test');
    const sut = createSignInEndWatch({ tokens, records });
    const listener = vi.fn();
    const stop = sut.subscribe(listener);
    /** Runs the clock on to `time`, with every timer that falls due on the way. */
    const until = (time: number) => vi.advanceTimersByTime(time - Date.now());
    return { sut, tokens, records, listener, stop, until };
  }

  it('never warns while the sign-in can still be renewed', () => {
    const { sut, listener, until } = setUp(SIGNED + HOUR, token(SIGNED));
    until(UNTIL - MINUTE);
    expect(sut.get()).toBeNull();
    until(UNTIL + MINUTE);
    expect(sut.get()).toBeNull();
    expect(listener).not.toHaveBeenCalled();
  });

  it('warns ten minutes before the last token runs out, and stops when it has', () => {
    const endsAt = SIGNED + 20 * HOUR;
    const { sut, listener, until } = setUp(SIGNED + 8 * HOUR, token(SIGNED + 8 * HOUR));
    until(endsAt - 10 * MINUTE - 1);
    expect(sut.get()).toBeNull();
    expect(listener).not.toHaveBeenCalled();
    until(endsAt - 10 * MINUTE);
    expect(sut.get()).toEqual({ endsAt });
    expect(listener).toHaveBeenCalledTimes(1);
    const shown = sut.get();
    until(endsAt - 1);
    expect(sut.get()).toBe(shown);
    until(endsAt);
    expect(sut.get()).toBeNull();
    expect(listener).toHaveBeenCalledTimes(2);
  });

  it('learns the end from a refusal when the answers do not say it, and warns at once if it is near', () => {
    const last = token(SIGNED + 8 * HOUR);
    const { sut, records, listener, until } = setUp(SIGNED + 19 * HOUR + 55 * MINUTE, last, {});
    expect(sut.get()).toBeNull();
    records.refused(last, Date.now());
    expect(sut.get()).toEqual({ endsAt: SIGNED + 20 * HOUR });
    expect(listener).toHaveBeenCalledTimes(1);
    until(SIGNED + 20 * HOUR);
    expect(sut.get()).toBeNull();
  });

  it('takes the notice away once someone signs in again', () => {
    const { sut, tokens, records, until } = setUp(SIGNED + 8 * HOUR, token(SIGNED + 8 * HOUR));
    until(SIGNED + 19 * HOUR + 52 * MINUTE);
    expect(sut.get()).toEqual({ endsAt: SIGNED + 20 * HOUR });
    const again = Date.now();
    const fresh = token(again, again);
    records.answered(fresh, answer(again + 12 * HOUR), 'advisor@marlowcreek.test');
    tokens.set(fresh);
    expect(sut.get()).toBeNull();
    until(again + 12 * HOUR);
    expect(sut.get()).toBeNull();
  });

  it('shows the right notice soon after a computer wakes, however long its timers slept', () => {
    const { sut, until } = setUp(SIGNED + 8 * HOUR, token(SIGNED + 8 * HOUR));
    // Asleep: the clock moves on and no timer runs.
    vi.setSystemTime(SIGNED + 19 * HOUR + 55 * MINUTE);
    expect(sut.get()).toBeNull();
    until(Date.now() + RECHECK_MS);
    expect(sut.get()).toEqual({ endsAt: SIGNED + 20 * HOUR });
  });

  it('keeps no timer while no one is listening', () => {
    const { stop } = setUp(SIGNED + 8 * HOUR, token(SIGNED + 8 * HOUR));
    expect(vi.getTimerCount()).toBe(1);
    stop();
    expect(vi.getTimerCount()).toBe(0);
  });
});
