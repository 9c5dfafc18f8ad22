import Database from 'better-sqlite3';
import { rmSync } from 'node:fs';
import fc from 'fast-check';
import { JwtService } from '@nestjs/jwt';
import request from 'supertest';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import { io } from 'socket.io-client';
import type { BoardSnapshot } from '@baytime/shared';
import {
  CALLERS,
  fuzzRequests,
  isRaw,
  offlineKey,
  target,
  toJson,
  type Caller,
  type CallerIds,
  type FuzzRequest,
  type OfflineKey,
  type Pools,
} from '../test-support/fuzz-requests.js';
import type { FuzzServer } from '../test-support/fuzz-server.js';
import { ROUTES, type Method } from '../test-support/routes.js';
import { ServerGone, startServerProcess, type ServerProcess } from '../test-support/server-process.js';
import { digestsOf } from '../test-support/table-digests.js';
import { ErrorsFilter } from './filters/errors.filter.js';
import { ROLE_REFUSAL } from './guards/auth.guard.js';

/**
 * 10,000 requests and socket events in all: 8,000 HTTP requests over every route, 500 handshakes,
 * and 150 connections of 1 handshake and 9 events each. `BAYTIME_FUZZ_SEED` runs another sample.
 */
const HTTP_REQUESTS = 8_000;
const HANDSHAKES = 500;
const CONNECTIONS = 150;
const EVENTS_PER_CONNECTION = 9;
const SEED = Number(process.env.BAYTIME_FUZZ_SEED ?? 20_261_202);
/**
 * How long the server may take over one request or socket event (or a call between them) before the
 * fuzz takes it for a hang, kills the server's process and fails naming the request. The slowest
 * request of the sample (a new user's password hashed) took 0.25 s on a 2-core machine under load.
 */
const DEADLINE_MS = 5_000;
/** Requests between two checks that the server still answers its health route. */
const HEALTH_EVERY = 100;

/**
 * Two tables change at moments that belong to no request. The seq mark is moved by live messages that
 * trail an accepted change (the late-line count is published after a pause), so it is checked to only
 * rise instead. The stored efficiencies are a cache that the late-line count refreshes on its own
 * timer, each minute as well as after a change.
 */
const TRAILING = ['live_sequence', 'stored_efficiencies'];
/** A refused sign-in is counted: that is the throttle doing its work. */
const SIGN_IN_ROUTES = ['/api/auth/login', '/api/auth/badge', '/api/auth/screens/pair'];

/**
 * Compares every table's content before a request or event with after it. A second, read-only
 * connection keeps a read transaction open on the state before (SQLite's WAL lets a reader keep its
 * snapshot while the server writes), so the "before" digests are computed only when SQLite says a
 * row was written meanwhile.
 */
class ChangeWatch {
  private readonly before: Database.Database;
  private written = -1;
  private seqMark = 0;

  constructor(private readonly sut: Server) {
    this.before = new Database(sut.ready.dbFile, { readonly: true, fileMustExist: true });
  }

  /** Holds the tables as they stand now, before a request. */
  async mark(): Promise<void> {
    const written = await this.sut.call('rowsWritten');
    if (written === this.written) return;
    this.written = written;
    if (this.before.inTransaction) this.before.exec('commit');
    this.before.exec('begin');
    const mark =
      (this.before.prepare('select reserved_up_to from live_sequence').pluck().get() as number | undefined) ??
      0;
    expect(mark, 'the seq mark only rises').toBeGreaterThanOrEqual(this.seqMark);
    this.seqMark = mark;
  }

  /** After a refused request or event: every table as it was, but for those `allowed`. */
  async expectUnchanged(label: string, allowed: string[] = []): Promise<void> {
    if ((await this.sut.call('rowsWritten')) === this.written) return;
    const except = [...TRAILING, ...allowed];
    expect(await this.sut.call('tableDigests', except), label).toEqual(digestsOf(this.before, except));
  }

  close(): void {
    if (this.before.inTransaction) this.before.exec('commit');
    this.before.close();
  }
}

type Server = ServerProcess<
  Awaited<ReturnType<FuzzServer>>['ready'],
  Awaited<ReturnType<FuzzServer>>['handlers']
>;

/** The callers whose tokens open the live socket: the kiosk's device token too (`AuthService.check`). */
const SOCKET_CALLERS: Caller[] = ['owner', 'foreman', 'advisor', 'technician', 'display', 'kiosk'];

/** How to send the failing sample again. */
const AGAIN = `(BAYTIME_FUZZ_SEED=${SEED} runs this sample again)`;

describe(ErrorsFilter.name, () => {
  // The server runs in a child process: a request that hangs it fails the test instead of freezing it.
  let sut: Server;
  let watch: ChangeWatch;
  let tokens: Record<Caller, string | undefined>;
  let callerIds: CallerIds;
  let pools: Pools;
  /** The key the kiosk caller seals its offline punches' badges and PINs to. */
  let key: OfflineKey;
  const http = () => request(sut.ready.url);
  const refreshPools = async () => {
    pools = await sut.call('pools', callerIds);
  };
  const expectHealthy = async (after: string) => {
    const response = await sut.within(fetch(`${sut.ready.url}/api/health`), `GET /api/health after ${after}`);
    expect(response.status, `GET /api/health after ${after}`).toBe(200);
  };

  beforeAll(async () => {
    sut = await startServerProcess<FuzzServer>(new URL('../test-support/fuzz-server.ts', import.meta.url), {
      deadlineMs: DEADLINE_MS,
    });
    watch = new ChangeWatch(sut);
    const owner = await sut.call('signIn', 'owner');
    const pairing = await http()
      .post('/api/screens')
      .auth(owner, { type: 'bearer' })
      .send({ name: 'Fuzz wall' })
      .expect(201);
    const paired = await http().post('/api/auth/screens/pair').send({ code: pairing.body.code }).expect(200);
    const [technician, otherTechnician] = [await sut.call('badge', '1043'), await sut.call('badge', '1045')];
    const kiosk = await sut.call('pairKiosk');
    tokens = {
      owner,
      foreman: await sut.call('signIn', 'foreman'),
      advisor: await sut.call('signIn', 'advisor'),
      technician: technician.accessToken,
      otherTechnician: otherTechnician.accessToken,
      display: paired.body.accessToken,
      kiosk: kiosk.accessToken,
      nobody: undefined,
      forged: new JwtService({ secret: 'not the server secret' }).sign(
        { sub: 1, role: 'owner' },
        { expiresIn: '1h' },
      ),
    };
    const callers = await Promise.all(
      (['owner', 'foreman', 'advisor'] as const).map(
        async (caller) =>
          (await http().get('/api/me').auth(tokens[caller]!, { type: 'bearer' }).expect(200)).body
            .id as number,
      ),
    );
    callerIds = {
      userIds: [...callers, technician.user.id, otherTechnician.user.id],
      screenIds: [pairing.body.id as number, kiosk.id],
    };
    key = offlineKey(
      (await http().get('/api/kiosks/me/offline-key').auth(kiosk.accessToken, { type: 'bearer' }).expect(200))
        .body,
    );
    await refreshPools();
  }, 90_000);
  beforeEach(() => {
    const gone = sut?.gone();
    if (gone) throw new Error(`The server is gone since an earlier test: ${gone.message}`);
  });
  afterAll(async () => {
    watch?.close();
    await sut?.stop();
    // A killed server leaves its data behind.
    if (sut) rmSync(sut.ready.dataDir, { recursive: true, force: true });
  });

  it(`answers ${HTTP_REQUESTS} random requests on every route below 500, and only accepted ones change a table`, async () => {
    const routes = await sut.call('routes');
    // The role matrix's routes name ids; as patterns they match the server's routes.
    const roles = new Map(
      ROUTES.map(([method, path, allowed]) => [
        `${method} ${path.replace(/\/(\d+|[0-9a-f-]{36})(?=\/|$)/, '/:id')}`,
        allowed,
      ]),
    );
    /** The callers the role matrix lets past the guard, if it names the route. */
    const letIn = (method: Method, route: string): Caller[] | undefined =>
      roles
        .get(`${method} ${route}`)
        ?.flatMap((role): Caller[] => (role === 'technician' ? ['technician', 'otherTechnician'] : [role]));
    const allowed = (method: Method, route: string): Caller[] => letIn(method, route) ?? [...CALLERS];
    const answered = new Map<string, Map<number, number>>();

    const send = async (request: FuzzRequest, url: string, text: string | undefined, label: string) => {
      const token = tokens[request.caller];
      const response = await sut.within(
        fetch(`${sut.ready.url}${url}`, {
          method: request.method.toUpperCase(),
          headers: {
            ...(text === undefined ? {} : { 'content-type': request.contentType }),
            ...(token ? { authorization: `Bearer ${token}` } : {}),
          },
          body: text,
        }).then(async (response) => ({ status: response.status, body: await response.text() })),
        label,
      );
      return response;
    };

    let sent = 0;
    await fc.assert(
      fc.asyncProperty(fuzzRequests(routes, allowed), async (request) => {
        const url = target(request, pools);
        const text =
          request.body === undefined
            ? undefined
            : isRaw(request.body)
              ? request.body.raw
              : toJson(request.body, pools, key);
        const label = `${request.caller} ${request.method.toUpperCase()} ${url}${text === undefined ? '' : ` ${text.slice(0, 300)}`}`;
        try {
          await watch.mark();
          const { status, body } = await send(
            request,
            url,
            text,
            `${label}\n(route ${request.route}) ${AGAIN}`,
          );
          expect(status, label).toBeLessThan(500);
          // A caller the role matrix lets in gets past the guard: its token still works.
          if (letIn(request.method, request.route)?.includes(request.caller))
            expect(
              status === 401 || (status === 403 && body.includes(ROLE_REFUSAL)),
              `${label}: the guard turned an allowed caller away: ${body}`,
            ).toBe(false);
          const key = `${request.method} ${request.route}`;
          const counts = answered.get(key) ?? new Map<number, number>();
          counts.set(status, (counts.get(status) ?? 0) + 1);
          answered.set(key, counts);
          const accepted = status >= 200 && status < 300;
          if (!accepted)
            await watch.expectUnchanged(
              label,
              SIGN_IN_ROUTES.includes(request.route) ? ['sign_in_throttles'] : [],
            );
          if (accepted) {
            await sut.call('settle');
            if (request.method !== 'get') await refreshPools();
          }
          if (++sent % HEALTH_EVERY === 0) await expectHealthy(label);
        } catch (error) {
          // A hang or crash found after the answer (in the server's work between requests) names it too.
          if (error instanceof ServerGone && !error.message.includes(label))
            throw new ServerGone(`${error.message}\nThe last request: ${label} ${AGAIN}`);
          throw error;
        }
      }),
      { numRuns: HTTP_REQUESTS, seed: SEED, endOnFailure: true },
    );

    const summary = [...answered].map(
      ([key, counts]) => `${key}: ${JSON.stringify(Object.fromEntries(counts))}`,
    );
    const acceptedOn = (key: string) =>
      [...(answered.get(key) ?? new Map<number, number>())].filter(([status]) => status < 300).length;
    // Every route was reached, and the writes on real rows were accepted at least once each: the fuzz
    // got past validation, not only bounced off it.
    expect(answered.size, summary.join('\n')).toBe(new Set(routes.map(([m, r]) => `${m} ${r}`)).size);
    for (const key of [
      'patch /api/users/:id',
      'patch /api/bays/:id',
      'patch /api/job-lines/:id',
      'patch /api/operations/:id',
      'patch /api/shop',
      'post /api/repair-orders',
      // Only the kiosk caller's token gets these accepted.
      'post /api/kiosks/me/queue',
      'post /api/kiosks/me/offline-punches',
    ])
      expect(acceptedOn(key), `${key}\n${summary.join('\n')}`).toBeGreaterThan(0);
    await expectHealthy('the last request');
  }, 600_000);

  const handshakeToken = fc.oneof(
    { weight: 4, arbitrary: fc.constantFrom<Caller>(...SOCKET_CALLERS) },
    { weight: 2, arbitrary: fc.constantFrom<Caller>('nobody', 'forged') },
    { weight: 2, arbitrary: fc.oneof(fc.string(), fc.anything({ maxDepth: 1 })) },
  );
  /** socket.io keeps these names for itself and will not send them. */
  const RESERVED = [
    'connect',
    'connect_error',
    'disconnect',
    'disconnecting',
    'newListener',
    'removeListener',
  ];
  const liveEvent = fc.record({
    name: fc.oneof(
      { weight: 1, arbitrary: fc.constant('board.snapshot') },
      {
        weight: 1,
        arbitrary: fc.constantFrom(
          'bay.updated',
          'punch.recorded',
          'exception',
          'error',
          '__proto__',
          'constructor',
        ),
      },
      { weight: 2, arbitrary: fc.string({ maxLength: 20 }).filter((name) => !RESERVED.includes(name)) },
    ),
    payload: fc.array(fc.anything({ maxDepth: 2 }), { maxLength: 2 }),
    withAck: fc.boolean(),
  });

  it(`refuses ${HANDSHAKES} random handshakes or lets them in, and changes nothing`, async () => {
    let handshakes = 0;
    await fc.assert(
      fc.asyncProperty(handshakeToken, async (token) => {
        const label = `handshake ${JSON.stringify(token)} ${AGAIN}`;
        await watch.mark();
        const auth =
          typeof token === 'string' && Object.hasOwn(tokens, token)
            ? { token: tokens[token as Caller] }
            : { token };
        const socket = io(sut.ready.url, {
          auth,
          transports: ['websocket'],
          reconnection: false,
          forceNew: true,
        });
        const opened = await sut.within(
          new Promise<boolean>((resolve) => {
            socket.once('connect', () => resolve(true));
            socket.once('connect_error', () => resolve(false));
          }),
          label,
        );
        handshakes++;
        socket.disconnect();
        expect(opened, `${JSON.stringify(token)}`).toBe(SOCKET_CALLERS.includes(token as Caller));
        // A wall screen that connects is marked as seen: the only write a handshake makes (not a kiosk).
        await watch.expectUnchanged(
          `handshake ${JSON.stringify(token)}`,
          token === 'display' ? ['screens'] : [],
        );
      }),
      { numRuns: HANDSHAKES, seed: SEED, endOnFailure: true },
    );
    expect(handshakes).toBe(HANDSHAKES);
  }, 120_000);

  it(`answers ${CONNECTIONS} connections of random events without an error, and changes nothing`, async () => {
    let events = 0;
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom<Caller>(...SOCKET_CALLERS),
        fc.array(liveEvent, { minLength: EVENTS_PER_CONNECTION, maxLength: EVENTS_PER_CONNECTION }),
        async (caller, emitted) => {
          const label = `${caller}: ${JSON.stringify(emitted)} ${AGAIN}`;
          await watch.mark();
          const socket = io(sut.ready.url, {
            auth: { token: tokens[caller] },
            transports: ['websocket'],
            reconnection: false,
            forceNew: true,
          });
          // Nest answers a handler's failure with an `exception` event: the socket's 500.
          const errors: unknown[] = [];
          (socket as unknown as { on: (event: string, listener: (error: unknown) => void) => void }).on(
            'exception',
            (error) => errors.push(error),
          );
          const onConnect = new Promise<BoardSnapshot>((resolve) => socket.once('board.snapshot', resolve));
          await sut.within(
            new Promise<void>((resolve, reject) => {
              socket.once('connect', resolve);
              socket.once('connect_error', reject);
            }),
            label,
          );
          events++;
          expect((await sut.within(onConnect, label)).bays.length).toBeGreaterThan(0);
          // A socket's budget answers five snapshot requests at once, then two a second: the first four
          // here must be answered, and one is kept for the round trip at the end.
          let snapshotRequests = 0;
          const answers: Promise<unknown>[] = [];
          for (const { name, payload, withAck } of emitted) {
            events++;
            const emit = socket.emit.bind(socket) as (event: string, ...args: unknown[]) => void;
            if (name === 'board.snapshot') snapshotRequests++;
            if (name === 'board.snapshot' && withAck && snapshotRequests <= 4) {
              answers.push(new Promise((resolve) => emit(name, ...payload, resolve)));
            } else emit(name, ...payload, ...(withAck ? [() => undefined] : []));
          }
          for (const answer of await sut.within(Promise.all(answers), label))
            expect((answer as BoardSnapshot).bays.length, JSON.stringify(emitted)).toBeGreaterThan(0);
          // The last round trip: every event above was handled before it, in order. It waits for the
          // budget to have a request again.
          if (snapshotRequests > 4)
            await new Promise((r) => setTimeout(r, (snapshotRequests - 4) * 500 + 50));
          const last: BoardSnapshot = await sut.within(socket.emitWithAck('board.snapshot'), label);
          socket.disconnect();
          expect(last.bays.length).toBeGreaterThan(0);
          expect(errors, JSON.stringify(emitted)).toEqual([]);
          await watch.expectUnchanged(
            `${caller}: ${JSON.stringify(emitted)}`,
            caller === 'display' ? ['screens'] : [],
          );
        },
      ),
      { numRuns: CONNECTIONS, seed: SEED, endOnFailure: true },
    );
    expect(events).toBe(CONNECTIONS * (1 + EVENTS_PER_CONNECTION));
    expect(HTTP_REQUESTS + HANDSHAKES + events).toBe(10_000);
    await expectHealthy('the last connection');
  }, 120_000);

  it('sends security headers and a content security policy', async () => {
    const { headers } = await http().get('/api/health').expect(200);
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
