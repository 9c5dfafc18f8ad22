import { afterEach, describe, expect, it, vi } from 'vitest';
import { ApiError, createApiClient, retryAfterSeconds } from './api-client.js';

describe(retryAfterSeconds.name, () => {
  // RFC 9110 §10.2.3: Retry-After = HTTP-date / delay-seconds.
  it('reads delay-seconds', () => {
    expect(retryAfterSeconds('240')).toBe(240);
    expect(retryAfterSeconds(' 0 ')).toBe(0);
  });

  it('reads an HTTP date as the seconds left until it', () => {
    const now = Date.parse('2026-12-02T10:00:00Z');
    expect(retryAfterSeconds('Wed, 02 Dec 2026 10:04:30 GMT', now)).toBe(270);
    expect(retryAfterSeconds('Wed, 02 Dec 2026 09:59:00 GMT', now)).toBe(0);
  });

  it('says nothing for a missing or unreadable header', () => {
    expect(retryAfterSeconds(null)).toBeNull();
    expect(retryAfterSeconds('soon')).toBeNull();
  });
});

describe('a refusal with Retry-After', () => {
  afterEach(() => vi.unstubAllGlobals());

  it('carries the wait on the ApiError', async () => {
    vi.stubGlobal(
      'fetch',
      vi.fn(
        async () =>
          new Response(JSON.stringify({ statusCode: 429, message: 'Too many wrong tries.' }), {
            status: 429,
            headers: { 'content-type': 'application/json', 'retry-after': '240' },
          }),
      ),
    );
    const error = await createApiClient({ getToken: () => null })
      .post('/auth/badge', {})
      .catch((e: unknown) => e);
    expect(error).toBeInstanceOf(ApiError);
    expect(error).toMatchObject({ status: 429, retryAfterSeconds: 240, message: 'Too many wrong tries.' });
  });
});
