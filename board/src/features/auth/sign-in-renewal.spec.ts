import { describe, expect, it, vi } from 'vitest';
import type { OfficeSignInAnswer } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import type { SignInRecord } from './sign-in-end';
import { createSignInRenewer, renewalDue, RETRY_AFTER_MS, tokenLife } from './sign-in-renewal';

const HOUR = 3_600_000;
const SIGNED = Date.UTC(2026, 2, 9, 7, 0);

/** A token as the server signs them (the signature is not read here), base64url without padding. */
function token(issuedAt: number, hours = 12, extra: object = {}): string {
  const part = (value: object) =>
    btoa(JSON.stringify(value)).replace(/\+/g, '-').replace(/\//g, '_').replace(/=+$/, '');
  const payload = {
    sub: 3,
    role: 'advisor',
    iat: issuedAt / 1000,
    exp: issuedAt / 1000 + hours * 3600,
    ...extra,
  };
  return `${part({ alg: 'HS256', typ: 'JWT' })}.${part(payload)}.signature`;
}

describe(tokenLife.name, () => {
  it('reads when the token was signed and when it runs out', () => {
    expect(tokenLife(token(SIGNED))).toEqual({ issuedAt: SIGNED, expiresAt: SIGNED + 12 * HOUR });
    // "?" and ">" in a name encode to the base64url alphabet's own characters.
    expect(tokenLife(token(SIGNED, 12, { name: '??>>' }))).toEqual({
      issuedAt: SIGNED,
      expiresAt: SIGNED + 12 * HOUR,
    });
  });

  it('reads when the password was given from an office token', () => {
    expect(tokenLife(token(SIGNED + HOUR, 12, { signedInAt: SIGNED / 1000 }))).toEqual({
      issuedAt: SIGNED + HOUR,
      expiresAt: SIGNED + 13 * HOUR,
      signedInAt: SIGNED,
    });
  });

  it('answers null for anything that is not a token with both times', () => {
    for (const text of ['', 'not-a-token', 'a.%%%.c', token(SIGNED, 0), `x.${btoa('{"exp":5}')}.y`])
      expect(tokenLife(text), text).toBeNull();
  });
});

describe(renewalDue.name, () => {
  const life = { issuedAt: SIGNED, expiresAt: SIGNED + 12 * HOUR };

  it('is due in the last third of the life, and not once it ran out', () => {
    expect(renewalDue(life, SIGNED + HOUR)).toBe(false);
    expect(renewalDue(life, SIGNED + 8 * HOUR - 1)).toBe(false);
    expect(renewalDue(life, SIGNED + 8 * HOUR + 1)).toBe(true);
    expect(renewalDue(life, SIGNED + 12 * HOUR - 1)).toBe(true);
    expect(renewalDue(life, SIGNED + 12 * HOUR)).toBe(false);
  });

  it('waits until the retry time after a failed try', () => {
    const now = SIGNED + 9 * HOUR;
    expect(renewalDue(life, now, now + 1)).toBe(false);
    expect(renewalDue(life, now, now)).toBe(true);
  });
});

describe(createSignInRenewer.name, () => {
  function setUp(
    stored: string | null,
    answers: (() => Promise<OfficeSignInAnswer>)[],
    record: SignInRecord | null = null,
  ) {
    let clock = SIGNED + 9 * HOUR;
    const tokens = { value: stored, get: () => tokens.value, set: (next: string) => (tokens.value = next) };
    const renew = vi.fn(() => answers.shift()!());
    const records = { of: () => record, answered: vi.fn(), refused: vi.fn() };
    const sut = createSignInRenewer({ tokens, records, renew, now: () => clock });
    return { sut, tokens, records, renew, now: () => clock, advance: (ms: number) => (clock += ms) };
  }
  const UNTIL = new Date(SIGNED + 12 * HOUR).toISOString();
  const answer = (accessToken: string) => () =>
    Promise.resolve({
      accessToken,
      user: { id: 3, name: 'Nell Ashby', role: 'advisor' as const },
      renewableUntil: UNTIL,
    });
  const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

  it('renews a token that is due, once at a time, and keeps the fresh one', async () => {
    const fresh = token(SIGNED + 9 * HOUR);
    const { sut, tokens, records, renew } = setUp(token(SIGNED), [answer(fresh)]);
    sut.renewIfDue();
    sut.renewIfDue();
    await settle();
    expect(renew).toHaveBeenCalledTimes(1);
    expect(tokens.value).toBe(fresh);
    expect(records.answered).toHaveBeenCalledWith(fresh, expect.objectContaining({ renewableUntil: UNTIL }));
    sut.renewIfDue();
    expect(renew).toHaveBeenCalledTimes(1);
  });

  it('leaves a token that is not due, or none', () => {
    const early = setUp(token(SIGNED + 2 * HOUR), []);
    early.sut.renewIfDue();
    const none = setUp(null, []);
    none.sut.renewIfDue();
    expect(early.renew).not.toHaveBeenCalled();
    expect(none.renew).not.toHaveBeenCalled();
  });

  it('keeps the token after a failed try and tries again after a pause', async () => {
    const old = token(SIGNED);
    const fresh = token(SIGNED + 9 * HOUR);
    const { sut, tokens, records, renew, advance } = setUp(old, [
      () => Promise.reject(new ApiError(0, 'No connection to the shop server')),
      answer(fresh),
    ]);
    sut.renewIfDue();
    await settle();
    expect(tokens.value).toBe(old);
    expect(records.refused).not.toHaveBeenCalled();
    advance(RETRY_AFTER_MS - 1);
    sut.renewIfDue();
    expect(renew).toHaveBeenCalledTimes(1);
    advance(1);
    sut.renewIfDue();
    await settle();
    expect(tokens.value).toBe(fresh);
  });

  it('stops asking once the server refuses to renew that sign-in, and records the refusal', async () => {
    const old = token(SIGNED);
    const { sut, records, renew, now, advance } = setUp(old, [
      () => Promise.reject(new ApiError(403, 'This sign-in can no longer be renewed: sign in again')),
    ]);
    sut.renewIfDue();
    await settle();
    expect(records.refused).toHaveBeenCalledWith(old, now());
    advance(RETRY_AFTER_MS * 10);
    sut.renewIfDue();
    expect(renew).toHaveBeenCalledTimes(1);
  });

  it('does not ask once the sign-in is known to be renewed no longer', () => {
    const renewable = setUp(token(SIGNED + HOUR), [], {
      signedInAt: SIGNED,
      renewableUntil: SIGNED + 12 * HOUR,
    });
    renewable.advance(3 * HOUR);
    renewable.sut.renewIfDue();
    expect(renewable.renew).not.toHaveBeenCalled();
  });

  it('keeps a sign-in made while the answer was on its way', async () => {
    let answered: (value: OfficeSignInAnswer) => void = () => {};
    const { sut, tokens } = setUp(token(SIGNED), [() => new Promise((resolve) => (answered = resolve))]);
    sut.renewIfDue();
    const someoneElse = token(SIGNED + 9 * HOUR, 12, { sub: 4 });
    tokens.set(someoneElse);
    answered({
      accessToken: token(SIGNED + 9 * HOUR),
      user: { id: 3, name: 'Nell Ashby', role: 'advisor' },
      renewableUntil: UNTIL,
    });
    await settle();
    expect(tokens.value).toBe(someoneElse);
  });
});
