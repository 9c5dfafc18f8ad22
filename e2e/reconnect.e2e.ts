import { randomUUID } from 'node:crypto';
import { io, type Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type {
  BoardSnapshot,
  ClientToServerEvents,
  ServerToClientEvents,
  SignInAnswer,
} from '@baytime/shared';
import { apiAs, type Api } from './support/floor.js';
import { pairingCode, startServer, type RunningServer } from './support/server.js';

type Client = Socket<ServerToClientEvents, ClientToServerEvents>;
type Sequenced = { seq: number };

/**
 * A wall screen written from the public live contract alone (API.md): a `board.snapshot` on connect
 * and on request; `bay.updated` replaces one bay, `floor.updated` the people, queue and late count;
 * every message carries the shop-wide `seq`, one more than the message before, so a gap means a
 * message was missed and the screen asks for a fresh snapshot. `loseEvery` drops that share of the
 * messages on arrival, the way a flaky link would.
 */
class ContractWall {
  board: BoardSnapshot | null = null;
  /** Per connection, the seq of each message as it arrived (before any was lost). */
  connections: number[][] = [];
  gaps = 0;
  answeredRequests = 0;
  private received = 0;
  private asking = false;

  constructor(
    readonly socket: Client,
    private readonly loseEvery = 0,
  ) {
    socket.on('connect', () => this.connections.push([]));
    socket.on('board.snapshot', (snapshot) => this.take(snapshot));
    socket.on('bay.updated', (event) =>
      this.apply(event, (board) => ({
        ...board,
        bays: board.bays.map((bay) => (bay.id === event.bay.id ? event.bay : bay)),
      })),
    );
    // `bayIds` orders the bays; one it names that this screen has not seen means a snapshot is due.
    socket.on('floor.updated', ({ people, queue, lateLines, bayIds, kioskQueues, ...event }) =>
      this.apply(event, (board) => {
        const known = new Map(board.bays.map((bay) => [bay.id, bay]));
        if (bayIds.some((id) => !known.has(id))) return null;
        const bays = bayIds.map((id) => known.get(id)!);
        return { ...board, bays, people, queue, lateLines, kioskQueues };
      }),
    );
    for (const other of [
      'punch.recorded',
      'job-line.updated',
      'timer.updated',
      'finding.created',
      'finding.answered',
      'repair-order.updated',
    ] as const)
      socket.on(other, (event: Sequenced) => this.apply(event, (board) => board));
  }

  /** Connects again and resolves with the snapshot the server sends on connect. */
  reconnect(): Promise<BoardSnapshot> {
    const snapshot = new Promise<BoardSnapshot>((resolve) => this.socket.once('board.snapshot', resolve));
    this.socket.connect();
    return snapshot;
  }

  private take(snapshot: BoardSnapshot): void {
    // An answer overtaken by messages already applied is older than what is shown.
    if (this.board && snapshot.seq < this.board.seq) return;
    this.board = snapshot;
  }

  /** `change` answers null when the message names something this screen has not seen. */
  private apply(event: Sequenced, change: (board: BoardSnapshot) => BoardSnapshot | null): void {
    this.connections.at(-1)!.push(event.seq);
    if (this.loseEvery && ++this.received % this.loseEvery === 0) return;
    if (!this.board || event.seq <= this.board.seq) return;
    if (event.seq !== this.board.seq + 1) {
      this.gaps++;
      return this.askForSnapshot();
    }
    const changed = change(this.board);
    if (!changed) return this.askForSnapshot();
    this.board = { ...changed, seq: event.seq };
  }

  /** Asks until answered: the server answers a few requests a second and is silent beyond that. */
  private askForSnapshot(): void {
    if (this.asking) return;
    this.asking = true;
    this.socket.timeout(1500).emit('board.snapshot', (error: Error | null, snapshot: BoardSnapshot) => {
      this.asking = false;
      if (error) return this.askForSnapshot();
      this.answeredRequests++;
      this.take(snapshot);
    });
  }
}

/** What the screens show, without the ticking parts (clocked seconds run on between messages). */
const shown = (snapshot: BoardSnapshot | null) =>
  snapshot && {
    bays: snapshot.bays.map(({ clockedSeconds: _c, ...bay }) => bay),
    people: snapshot.people.map(({ since: _s, ...person }) => person),
    queue: snapshot.queue,
    lateLines: snapshot.lateLines,
  };

describe('screens dropped and restored mid-stream', () => {
  let server: RunningServer;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(() => server?.stop());

  it('every screen converges to the true board, and replayed kiosk punches count once', async () => {
    const tokens = await Promise.all(
      Array.from({ length: 6 }, async () => {
        const response = await fetch(`${server.url}/api/auth/screens/pair`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ code: await pairingCode(server) }),
        });
        return ((await response.json()) as { accessToken: string }).accessToken;
      }),
    );
    // Three screens drop out and come back; two stay; one loses every fifth message on arrival.
    const walls = tokens.map(
      (token, i) =>
        new ContractWall(
          io(server.url, { auth: { token }, transports: ['websocket'], reconnection: false }),
          i === 5 ? 5 : 0,
        ),
    );
    const dropping = walls.slice(0, 3);
    const lossy = walls[5]!;
    await expect.poll(() => walls.every((wall) => wall.board !== null), { timeout: 10_000 }).toBe(true);

    const techs = await Promise.all(
      ['1041', '1042', '1043', '1044', '1045', '1046'].map(async (badge) => {
        const response = await fetch(`${server.url}/api/auth/badge`, {
          method: 'POST',
          headers: { 'content-type': 'application/json' },
          body: JSON.stringify({ badge, pin: '4321' }),
        });
        return (await response.json()) as SignInAnswer;
      }),
    );
    const sent: { tech: SignInAnswer; body: object }[] = [];
    const punch = async (tech: SignInAnswer, body: object) => {
      const response = await fetch(`${server.url}/api/punches`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${tech.accessToken}` },
        body: JSON.stringify(body),
      });
      if (response.status === 201) sent.push({ tech, body });
      return response;
    };

    // Breaks on and off for everyone while half the screens drop out and come back.
    for (let round = 0; round < 6; round++) {
      if (round === 1) for (const wall of dropping) wall.socket.disconnect();
      if (round === 4) await Promise.all(dropping.map((wall) => wall.reconnect()));
      await Promise.all(
        techs.map((tech) =>
          punch(tech, {
            id: randomUUID(),
            kind: round % 2 === 0 ? 'break-start' : 'break-end',
            breakKind: 'rest',
          }),
        ),
      );
    }
    // A kiosk outbox that missed the answers replays what was stored: each answers 200, nothing is added.
    const stored = sent.length;
    const replays = await Promise.all(sent.slice().map(({ tech, body }) => punch(tech, body)));
    expect(replays.map((r) => r.status)).toEqual(Array(stored).fill(200));
    expect(stored).toBeGreaterThan(20);

    const truth = await foreman<BoardSnapshot>('GET', '/board');
    for (const wall of walls)
      await expect.poll(() => shown(wall.board), { timeout: 10_000 }).toEqual(shown(truth));
    // A screen hears every message: on each connection the seq rose by exactly one from message to
    // message. The dropped screens had two connections each.
    for (const wall of walls) {
      expect(wall.connections).toHaveLength(dropping.includes(wall) ? 2 : 1);
      for (const seqs of wall.connections) {
        expect(seqs.length).toBeGreaterThan(1);
        expect(seqs.slice(1)).toEqual(seqs.slice(0, -1).map((seq) => seq + 1));
      }
    }
    // The lossy screen saw gaps and caught up through answered snapshot requests, not a reconnect.
    expect(lossy.gaps).toBeGreaterThan(0);
    expect(lossy.answeredRequests).toBeGreaterThan(0);
    expect(lossy.socket.connected).toBe(true);
    for (const wall of walls) wall.socket.disconnect();

    for (const tech of techs) {
      const card = await foreman<{ punches: { id: string }[] }>(
        'GET',
        `/timecards?technicianId=${tech.user.id}`,
      );
      expect(new Set(card.punches.map((p) => p.id)).size).toBe(card.punches.length);
    }
  });
});
