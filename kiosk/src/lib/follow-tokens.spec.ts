// @vitest-environment node
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { TimerDto } from '@baytime/shared';

/** The live link as the tablet drives it: which token it is up on, or null when it is down. */
const link = vi.hoisted(() => ({
  token: null as string | null,
  refused: null as (() => void) | null,
}));
vi.mock('./socket', () => ({
  live: {
    connect(token: string, refused: () => void) {
      link.token = token;
      link.refused = refused;
    },
    disconnect() {
      link.token = null;
      link.refused = null;
    },
  },
}));

const HOUR = 3600_000;
const T0 = Date.parse('2026-03-10T13:00:00.000Z');
const DEVICE = 'device-token-of-the-kiosk-by-bay-3';
const luis = { id: 7, name: 'Luis Brennan', role: 'technician' as const };

/** A technician's sign-in token as the server signs it: good for 2 hours (only `exp` is read here). */
function technicianToken(issuedAt: number): string {
  const part = (value: object) => Buffer.from(JSON.stringify(value)).toString('base64url');
  return `${part({ alg: 'HS256' })}.${part({ sub: luis.id, role: 'technician', exp: (issuedAt + 2 * HOUR) / 1000 })}.sig`;
}

/** The kiosk's modules afresh, as a reload would load them (nothing kept in storage under node). */
async function tablet() {
  vi.resetModules();
  const [{ followTokens }, { session }, { device }, { queryClient }, { queryKeys }, apiClient] =
    await Promise.all([
      import('./follow-tokens'),
      import('./session'),
      import('./device'),
      import('./query-client'),
      import('./query-keys'),
      import('./api-client'),
    ]);
  return { followTokens, session, device, queryClient, queryKeys, ...apiClient };
}

/** The token `GET /api/timers` goes with, through the client the timer alerts fetch with. */
async function timersFetchedWith(api: { get: <T>(path: string) => Promise<T> }): Promise<string | null> {
  const fetch = vi.fn(
    async (..._: Parameters<typeof globalThis.fetch>) =>
      new Response('[]', { status: 200, headers: { 'content-type': 'application/json' } }),
  );
  vi.stubGlobal('fetch', fetch);
  await api.get('/timers');
  const headers = (fetch.mock.calls[0]?.[1]?.headers ?? {}) as Record<string, string>;
  return headers.Authorization?.replace(/^Bearer /, '') ?? null;
}

const running = [{ id: 1, kind: 'set-time', bayId: 3, lineTechnicianId: luis.id }] as TimerDto[];

describe('followTokens', () => {
  beforeEach(() => {
    vi.useFakeTimers({ now: T0 });
    link.token = null;
    link.refused = null;
  });
  afterEach(() => {
    vi.useRealTimers();
    vi.unstubAllGlobals();
  });

  it("keeps hearing timers on the tablet's own token when the last sign-in here ran out hours ago", async () => {
    const { followTokens, session, device, queryClient, queryKeys, watchApi, watchToken } = await tablet();
    device.set(DEVICE);
    const stop = followTokens();
    session.set(technicianToken(Date.now()), luis);
    queryClient.setQueryData(queryKeys.timers(), running);
    session.clear('tapped');

    // Two hours and a minute later nobody has signed in again: Luis's token is no good any more.
    vi.advanceTimersByTime(2 * HOUR + 60_000);
    expect(link.token).toBe(DEVICE);
    expect(watchToken()).toBe(DEVICE);
    expect(await timersFetchedWith(watchApi)).toBe(DEVICE);
    expect(queryClient.getQueryData(queryKeys.timers())).toEqual(running);
    stop();
  });

  it("goes over to the tablet's token at once when a technician's sign-in is refused as run out", async () => {
    const { followTokens, session, device, watchToken } = await tablet();
    device.set(DEVICE);
    const stop = followTokens();
    const token = technicianToken(Date.now());
    session.set(token, luis);
    // The signed-in screens hold the link on the technician's token meanwhile.
    link.token = token;
    vi.advanceTimersByTime(2 * HOUR);
    session.clear('expired');
    expect(link.token).toBe(DEVICE);
    expect(watchToken()).toBe(DEVICE);
    stop();
  });

  it('forgets the pairing when the server refuses the tablet, and stops listening', async () => {
    const { followTokens, device, queryClient, queryKeys, watchToken } = await tablet();
    device.set(DEVICE);
    queryClient.setQueryData(queryKeys.timers(), running);
    const stop = followTokens();
    expect(link.token).toBe(DEVICE);
    link.refused?.();
    expect(device.token()).toBeNull();
    expect(link.token).toBeNull();
    expect(watchToken()).toBeNull();
    expect(queryClient.getQueryData(queryKeys.timers())).toBeUndefined();
    stop();
  });
});
