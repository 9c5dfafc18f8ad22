import fc from 'fast-check';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { io } from 'socket.io-client';
import { SQLITE, type Sqlite } from '../db/database.js';
import { ROUTES } from '../test-support/routes.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ErrorsFilter } from './filters/errors.filter.js';

/** Rows per table: what "the database is unchanged" means here. */
function tableCounts(sqlite: Sqlite): Record<string, number> {
  const tables = sqlite.connection
    .prepare(
      "select name from sqlite_master where type = 'table' and name not like 'sqlite_%' and name not like '__drizzle%'",
    )
    .all() as { name: string }[];
  return Object.fromEntries(
    tables.map(({ name }) => [
      name,
      (sqlite.connection.prepare(`select count(*) as n from "${name}"`).get() as { n: number }).n,
    ]),
  );
}

/** Ids that name nothing, or are not ids at all, so no random body can act on a real row. */
const badId = fc.oneof(
  fc.integer({ min: 900_000, max: 2 ** 31 }),
  fc
    .string({ maxLength: 12 })
    // A string of digits may name a real row: those are the integer arbitrary's job, above 900,000.
    .filter((text) => !/^\d+$/.test(text.trim()))
    .map(encodeURIComponent),
  fc.constantFrom('-1', '0', '1.5', '%00', '..%2F..%2Fetc'),
);
const junk = fc.oneof(
  fc.anything(),
  fc.json().map((text) => ({ raw: text })),
  fc.dictionary(fc.string({ maxLength: 12 }), fc.anything()),
);

const isRaw = (body: unknown): body is { raw: string } =>
  typeof body === 'object' && body !== null && typeof (body as { raw?: unknown }).raw === 'string';

describe(ErrorsFilter.name, () => {
  let sut: TestApp;
  let tokens: string[];
  /** Bodies as raw text, so the fuzz can send what no well-behaved client library would. */
  const rawRequest = async (method: string, path: string, body: string, token?: string) => {
    const response = await fetch(`${sut.url}${path}`, {
      method: method.toUpperCase(),
      headers: { 'content-type': 'application/json', ...(token ? { authorization: `Bearer ${token}` } : {}) },
      body,
    });
    await response.arrayBuffer();
    return response;
  };
  beforeAll(async () => {
    sut = await startTestApp();
    tokens = [
      await sut.signIn(DEMO.owner),
      await sut.signIn(DEMO.foreman),
      await sut.signIn(DEMO.advisor),
      (await sut.badge('1043')).accessToken,
    ];
  });
  afterAll(() => sut.close());

  it('answers random and malformed requests on every route with 4xx, never 5xx, and changes nothing', async () => {
    const before = tableCounts(sut.app.get<Sqlite>(SQLITE));
    // Only writes are fuzzed with bodies; `:id`-like segments get ids that name nothing.
    const routes = ROUTES.filter(([method, path]) => method !== 'get' && !path.includes('/auth/'));
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...routes),
        fc.constantFrom(...tokens),
        badId,
        junk,
        async ([method, path], token, id, body) => {
          const target = path.replace(/\/(\d+|[0-9a-f-]{36})(?=\/|$)/, `/${id}`);
          const text = isRaw(body) ? `${body.raw}}` : JSON.stringify(body ?? null);
          const response = await rawRequest(method, target, text, token);
          // Only an empty change may succeed (a PATCH of nothing answers the record unchanged).
          const empty =
            body === null || (typeof body === 'object' && Object.keys(body as object).length === 0);
          if (!empty)
            expect(response.status, `${method} ${target} ${text.slice(0, 200)}`).toBeGreaterThanOrEqual(400);
          expect(response.status).toBeLessThan(500);
        },
      ),
      { numRuns: 400 },
    );
    expect(tableCounts(sut.app.get<Sqlite>(SQLITE))).toEqual(before);
    await sut.http().get('/api/health').expect(200);
  }, 90_000);

  it('answers random bodies on the sign-in routes with 400, 401 or 429', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom('/api/auth/login', '/api/auth/badge', '/api/auth/screens/pair'),
        junk,
        async (path, body) => {
          const response = await rawRequest('post', path, JSON.stringify(body ?? null));
          expect([400, 401, 429]).toContain(response.status);
        },
      ),
      { numRuns: 150 },
    );
  }, 90_000);

  it('survives random socket handshakes and events', async () => {
    const before = tableCounts(sut.app.get<Sqlite>(SQLITE));
    await fc.assert(
      fc.asyncProperty(
        fc.oneof(fc.constantFrom(...tokens), fc.string()),
        fc.string({ maxLength: 20 }),
        fc.anything(),
        async (token, event, payload) => {
          const socket = io(sut.url, { auth: { token }, transports: ['websocket'], reconnection: false });
          await new Promise<void>((resolve) => {
            socket.on('connect', () => {
              socket.emit(event, payload);
              socket.emit('board.snapshot', payload);
              setTimeout(resolve, 20);
            });
            socket.on('disconnect', () => resolve());
            socket.on('connect_error', () => resolve());
          });
          socket.disconnect();
        },
      ),
      { numRuns: 60 },
    );
    expect(tableCounts(sut.app.get<Sqlite>(SQLITE))).toEqual(before);
    await sut.http().get('/api/health').expect(200);
  }, 90_000);

  it('sends security headers and a content security policy', async () => {
    const { headers } = await sut.http().get('/api/health').expect(200);
    expect(headers['content-security-policy']).toContain("default-src 'self'");
    // The kiosk's service worker and manifest: from this server only.
    const policy = String(headers['content-security-policy']).split(';');
    expect(policy).toContain("worker-src 'self'");
    expect(policy).toContain("manifest-src 'self'");
    expect(headers['x-content-type-options']).toBe('nosniff');
    expect(headers['x-frame-options']).toBe('SAMEORIGIN');
    expect(headers['x-powered-by']).toBeUndefined();
  });
});
