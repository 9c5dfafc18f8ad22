import { HttpException, HttpStatus } from '@nestjs/common';

/**
 * Counts failed sign-ins per badge or e-mail: after `limit` failures within `windowMs` the
 * credential is locked for the rest of the window, which makes guessing a 4-digit PIN impractical.
 */
export class FailedAttempts {
  private readonly failures = new Map<string, number[]>();

  constructor(
    private readonly limit = 5,
    private readonly windowMs = 5 * 60_000,
  ) {}

  assertAllowed(key: string, now = Date.now()): void {
    if (this.recent(key, now).length >= this.limit)
      throw new HttpException(
        { statusCode: 429, message: 'Too many wrong tries: wait a few minutes' },
        HttpStatus.TOO_MANY_REQUESTS,
      );
  }

  fail(key: string, now = Date.now()): void {
    this.failures.set(key, [...this.recent(key, now), now]);
  }

  succeed(key: string): void {
    this.failures.delete(key);
  }

  private recent(key: string, now: number): number[] {
    return (this.failures.get(key) ?? []).filter((at) => now - at < this.windowMs);
  }
}
