import { describe, expect, it, vi } from 'vitest';
import { ApiError } from '@baytime/shared/client';

vi.mock('@/lib/api-client', () => ({ api: {} }));
vi.mock('@/lib/commands', () => ({ sendCommand: vi.fn() }));

const { lockText, signInLockedUntil } = await import('./badge-sign-in');

describe('sign-in lock', () => {
  it('lasts as long as the server’s Retry-After says', () => {
    const now = 1_000_000;
    expect(signInLockedUntil(new ApiError(429, 'Too many wrong tries.', {}, 240), now)).toBe(now + 240_000);
    expect(signInLockedUntil(new ApiError(429, 'Too many wrong tries.'), now)).toBeNull();
    expect(signInLockedUntil(new ApiError(401, 'Badge or PIN not recognised', {}, 240), now)).toBeNull();
  });

  it('says how long is left, not "a minute"', () => {
    expect(lockText(240)).toBe('Too many tries. Try again in 4 min.');
    expect(lockText(45)).toBe('Too many tries. Try again in 45 s.');
    expect(lockText(0)).toBe('Too many tries. Try again in 1 s.');
  });
});
