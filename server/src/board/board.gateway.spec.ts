import type { Socket as TcpSocket } from 'node:net';
import type { Server } from 'socket.io';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { JwtService } from '@nestjs/jwt';
import type { BoardSnapshot, DispatchBoard, LiveRefusal } from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type LiveClient, type TestApp } from '../test-support/test-app.js';
import { BoardGateway } from './board.gateway.js';

/** The refusal the handshake answered with; rejects if the socket connects instead. */
function refusalOf(socket: LiveClient): Promise<LiveRefusal> {
  return new Promise((resolve, reject) => {
    socket.on('connect', () => reject(new Error('The socket connected')));
    socket.on('connect_error', (error) => resolve((error as Error & { data: LiveRefusal }).data));
  });
}

/** Resolves with the disconnect reason and how long after `since` it came. */
function closed(socket: LiveClient, since: () => number): Promise<{ reason: string; afterMs: number }> {
  return new Promise((resolve) =>
    socket.once('disconnect', (reason) => resolve({ reason, afterMs: Date.now() - since() })),
  );
}

describe(BoardGateway.name, () => {
  let sut: TestApp;
  let owner: string;
  let sign: JwtService;
  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    sign = new JwtService({ secret: sut.config.jwtSecret });
  });
  afterAll(() => sut.close());

  const pairScreen = async (name: string) => {
    const { body: pairing } = await sut
      .http()
      .post('/api/screens')
      .auth(owner, { type: 'bearer' })
      .send({ name })
      .expect(201);
    const { body } = await sut.http().post('/api/auth/screens/pair').send({ code: pairing.code }).expect(200);
    return { id: pairing.id as number, token: body.accessToken as string };
  };

  it('sends a snapshot on connect and answers a snapshot request on the same socket', async () => {
    const socket = sut.connect(owner);
    const onConnect = await nextEvent(socket, 'board.snapshot');
    const answer: BoardSnapshot = await socket.timeout(2000).emitWithAck('board.snapshot');
    expect(answer.bays.map((bay) => bay.name)).toEqual(onConnect.bays.map((bay) => bay.name));
    expect(answer.bays).toHaveLength(8);
    expect(answer.seq).toBe(onConnect.seq);
  });

  it('sends each of many sockets connecting at once exactly one snapshot', async () => {
    const sockets = Array.from({ length: 12 }, () => sut.connect(owner));
    const counts = sockets.map(() => 0);
    sockets.forEach((socket, i) => socket.on('board.snapshot', () => counts[i]!++));
    const firsts = await Promise.all(sockets.map((socket) => nextEvent(socket, 'board.snapshot')));
    await new Promise((resolve) => setTimeout(resolve, 200));
    expect(counts).toEqual(sockets.map(() => 1));
    expect(new Set(firsts.map((snapshot) => snapshot.bays.length))).toEqual(new Set([8]));
    for (const socket of sockets) socket.close();
  });

  it('answers a burst of requests only up to its budget, and stays connected', async () => {
    const socket = sut.connect(owner);
    await nextEvent(socket, 'board.snapshot');
    const answers = await Promise.allSettled(
      Array.from({ length: 50 }, () => socket.timeout(1500).emitWithAck('board.snapshot')),
    );
    const answered = answers.filter((answer) => answer.status === 'fulfilled').length;
    expect(answered).toBeGreaterThanOrEqual(5);
    expect(answered).toBeLessThan(10);
    expect(socket.connected).toBe(true);
    // The budget refills: a request a second later is answered again.
    const later: BoardSnapshot = await socket.timeout(2000).emitWithAck('board.snapshot');
    expect(later.bays).toHaveLength(8);
  });

  it.each([
    ['no token', (): string | undefined => undefined, 'token-missing'],
    [
      'a token signed with another secret',
      () => new JwtService({ secret: 'x' }).sign({ sub: 1, role: 'owner' }),
      'token-invalid',
    ],
    ['an expired token', () => sign.sign({ sub: 1, role: 'owner' }, { expiresIn: -10 }), 'token-expired'],
    ['a token without an expiry', () => sign.sign({ sub: 1, role: 'owner' }), 'token-no-expiry'],
  ] as const)('refuses %s in the handshake with a reason code', async (_, token, reason) => {
    const socket = sut.connect(token() as string);
    const snapshots: unknown[] = [];
    socket.on('board.snapshot', (snapshot) => snapshots.push(snapshot));
    const refusal = await refusalOf(socket);
    expect(refusal.reason).toBe(reason);
    expect(refusal.message.length).toBeGreaterThan(5);
    expect(socket.connected).toBe(false);
    expect(snapshots).toEqual([]);
  });

  it('refuses a token without an expiry over HTTP too', async () => {
    await sut
      .http()
      .get('/api/me')
      .auth(sign.sign({ sub: 1, role: 'owner' }), { type: 'bearer' })
      .expect(401);
  });

  it("closes a revoked screen's socket within a second, and refuses it afterwards as revoked", async () => {
    const screen = await pairScreen('Paint shop TV');
    const socket = sut.connect(screen.token);
    await nextEvent(socket, 'board.snapshot');
    let revokedAt = 0;
    const ended = nextEvent(socket, 'session.ended');
    const disconnected = closed(socket, () => revokedAt);
    revokedAt = Date.now();
    await sut.http().delete(`/api/screens/${screen.id}`).auth(owner, { type: 'bearer' }).expect(200);
    expect((await ended).reason).toBe('screen-revoked');
    const { reason, afterMs } = await disconnected;
    expect(reason).toBe('io server disconnect');
    expect(afterMs).toBeLessThan(1000);

    const again = sut.connect(screen.token);
    expect((await refusalOf(again)).reason).toBe('screen-revoked');
  });

  it("sends a line's change to the floor and to the kiosks it concerns, and to no other kiosk", async () => {
    const techs = await Promise.all(DEMO.badges.map((badge) => sut.badge(badge)));
    const dispatch = (await sut.http().get('/api/dispatch').auth(owner, { type: 'bearer' }).expect(200))
      .body as DispatchBoard;
    const lane = dispatch.lanes.find((each) => each.lines.some((line) => line.status === 'queued'))!;
    const line = lane.lines.find((each) => each.status === 'queued')!;
    const from = techs.find((tech) => tech.user.id === lane.technician.id)!;
    const [to, bystander] = techs.filter((tech) => tech !== from);
    const sockets = [owner, from.accessToken, to!.accessToken, bystander!.accessToken].map((token) =>
      sut.connect(token),
    );
    await Promise.all(sockets.map((socket) => nextEvent(socket, 'board.snapshot')));
    const heard = sockets.map(() => [] as number[]);
    sockets.forEach((socket, i) =>
      socket.on('job-line.updated', ({ jobLine }) => heard[i]!.push(jobLine.id)),
    );
    // The bystander is not waited on: a wait for it would fail after the test, unheard.
    const [office, before, after] = sockets
      .slice(0, 3)
      .map((socket) => nextEvent(socket, 'job-line.updated', ({ jobLine }) => jobLine.id === line.id));
    await sut
      .http()
      .patch(`/api/job-lines/${line.id}`)
      .auth(owner, { type: 'bearer' })
      .send({ technicianId: to!.user.id })
      .expect(200);
    // The office, the kiosk that had the line and the kiosk that has it now all hear of it.
    expect((await office)!.jobLine.technicianId).toBe(to!.user.id);
    expect((await before)!.jobLine.technicianId).toBe(to!.user.id);
    expect((await after)!.jobLine.technicianId).toBe(to!.user.id);
    // A kiosk the line never concerned hears nothing of it.
    await sut.http().get('/api/health').expect(200);
    expect(heard[3]).toEqual([]);
  });

  it("writes one change's messages to a board in one write", async () => {
    const jo = await sut.badge('1045');
    const board = sut.connect(owner);
    await nextEvent(board, 'board.snapshot');
    // The board's connection as the server holds it, down to its TCP socket.
    const io = (sut.app.get(BoardGateway) as unknown as { server: Server }).server;
    const engine = io.sockets.sockets.get(board.id!)!.conn as unknown as {
      transport: { socket: { _socket: TcpSocket } };
    };
    const tcp = engine.transport.socket._socket;
    const writes: number[] = [];
    const spy = (method: '_write' | '_writev') => {
      const original = tcp[method] as (...args: unknown[]) => void;
      tcp[method] = ((...args: unknown[]) => {
        writes.push(method === '_writev' ? (args[0] as unknown[]).length : 1);
        original.apply(tcp, args);
      }) as never;
    };
    spy('_write');
    spy('_writev');
    const messages: string[] = [];
    board.onAny((event: string) => messages.push(event));
    const shown = nextEvent(board, 'floor.updated', ({ people }) =>
      people.some((person) => person.id === jo.user.id && person.status === 'on-break'),
    );
    await sut.punch(jo.accessToken, { kind: 'break-start', breakKind: 'rest' }).expect(201);
    await shown;
    // The punch and the floor it changed: two frames (a header and a body each), one system call.
    expect(messages).toEqual(['punch.recorded', 'floor.updated']);
    expect(writes).toEqual([4]);
  });

  it("closes a deactivated technician's socket, and leaves others connected", async () => {
    const sam = await sut.badge('1046');
    const jo = await sut.badge('1045');
    await sut.punch(sam.accessToken, { kind: 'shift-out' }).expect(201);
    const samSocket = sut.connect(sam.accessToken);
    const joSocket = sut.connect(jo.accessToken);
    await Promise.all([nextEvent(samSocket, 'board.snapshot'), nextEvent(joSocket, 'board.snapshot')]);
    const ended = nextEvent(samSocket, 'session.ended');
    const disconnected = closed(samSocket, () => 0);
    await sut
      .http()
      .patch(`/api/users/${sam.user.id}`)
      .auth(owner, { type: 'bearer' })
      .send({ active: false })
      .expect(200);
    expect((await ended).reason).toBe('account-inactive');
    expect((await disconnected).reason).toBe('io server disconnect');
    expect(joSocket.connected).toBe(true);
    expect((await refusalOf(sut.connect(sam.accessToken))).reason).toBe('account-inactive');
  });

  it('closes a socket when its token expires', async () => {
    const me = (await sut.http().get('/api/me').auth(owner, { type: 'bearer' }).expect(200)).body as {
      id: number;
    };
    const shortLived = sign.sign({ sub: me.id, role: 'owner' }, { expiresIn: 2 });
    const socket = sut.connect(shortLived);
    await nextEvent(socket, 'board.snapshot');
    const ended = await nextEvent(socket, 'session.ended', () => true, 4000);
    expect(ended.reason).toBe('token-expired');
    await expect.poll(() => socket.connected).toBe(false);
  });
});
