import { describe, expect, it } from 'vitest';
import { clockFromServerTime, secondsSince, secondsUntil, serverNow } from './server-clock';

describe(clockFromServerTime.name, () => {
  it('measures how far the screen clock is from the server clock', () => {
    const sut = clockFromServerTime('2026-03-02T15:00:30.000Z', Date.parse('2026-03-02T15:00:00.000Z'));
    expect(sut.offsetMs).toBe(30_000);
    expect(serverNow(sut, Date.parse('2026-03-02T15:01:00.000Z'))).toBe(
      Date.parse('2026-03-02T15:01:30.000Z'),
    );
  });

  it('falls back to no offset for a time it cannot read', () => {
    expect(clockFromServerTime('not a time', 1000).offsetMs).toBe(0);
  });
});

describe('secondsSince and secondsUntil', () => {
  const now = Date.parse('2026-03-02T15:00:00.000Z');
  it('counts whole seconds and never goes negative', () => {
    expect(secondsSince('2026-03-02T14:58:59.500Z', now)).toBe(60);
    expect(secondsSince('2026-03-02T15:00:05.000Z', now)).toBe(0);
    expect(secondsSince(null, now)).toBe(0);
    expect(secondsUntil('2026-03-02T15:04:05.200Z', now)).toBe(246);
    expect(secondsUntil('2026-03-02T14:00:00.000Z', now)).toBe(0);
    expect(secondsUntil(null, now)).toBeNull();
  });
});
