import { randomUUID } from 'node:crypto';
import { io, type Socket } from 'socket.io-client';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type {
  BoardSnapshot,
  ClientToServerEvents,
  ServerToClientEvents,
  SignInAnswer,
} from '@baytime/shared';
import {
  applyEvent,
  boardFromSnapshot,
  type BoardData,
  type BoardEvent,
} from '../board/src/features/wall/board-store';
import { apiAs, type Api } from './support/floor.js';
import { pairingCode, startServer, type RunningServer } from './support/server.js';

type Client = Socket<ServerToClientEvents, ClientToServerEvents>;

/** A wall board's view kept by the board app's own store: events applied in order, a snapshot on a gap. */
class BoardView {
  board: BoardData | null = null;
  constructor(readonly socket: Client) {
    socket.on('board.snapshot', (snapshot) => (this.board = boardFromSnapshot(snapshot, Date.now())));
    socket.on('bay.updated', ({ seq, bay }) => this.apply({ type: 'bay.updated', seq, bay }));
    socket.on('floor.updated', ({ seq, people, queue, lateLines, kioskQueues }) =>
      this.apply({ type: 'floor.updated', seq, people, queue, lateLines, kioskQueues }),
    );
    for (const event of ['punch.recorded', 'job-line.updated', 'timer.updated', 'finding.created'] as const)
      socket.on(event, ({ seq }: { seq: number }) => this.apply({ type: 'other', seq }));
  }
  private apply(event: BoardEvent) {
    const result = applyEvent(this.board, event, Date.now());
    this.board = result.board;
    if (result.resync)
      this.socket.emit(
        'board.snapshot',
        (snapshot) => (this.board = boardFromSnapshot(snapshot, Date.now())),
      );
  }
}

/** What the screens show, without the ticking parts (clocked seconds run on between messages). */
const shown = (snapshot: BoardSnapshot | undefined) =>
  snapshot && {
    bays: snapshot.bays.map(({ clockedSeconds: _c, ...bay }) => bay),
    people: snapshot.people.map(({ since: _s, ...person }) => person),
    queue: snapshot.queue,
  };

describe('screens dropped and restored mid-stream', () => {
  let server: RunningServer;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(() => server?.stop());

  it('every board converges to a fresh snapshot, and replayed kiosk punches count once', async () => {
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
    const views = tokens.map(
      (token) => new BoardView(io(server.url, { auth: { token }, transports: ['websocket'] })),
    );
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

    // Breaks on and off for everyone while half the boards drop out and come back.
    for (let round = 0; round < 6; round++) {
      if (round === 1) for (const view of views.slice(0, 3)) view.socket.disconnect();
      if (round === 4) for (const view of views.slice(0, 3)) view.socket.connect();
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
    for (const view of views)
      await expect.poll(() => shown(view.board?.snapshot), { timeout: 5000 }).toEqual(shown(truth));
    for (const view of views) view.socket.disconnect();

    const techIds = techs.map((t) => t.user.id);
    for (const id of techIds) {
      const card = await foreman<{ punches: { id: string }[] }>('GET', `/timecards?technicianId=${id}`);
      expect(new Set(card.punches.map((p) => p.id)).size).toBe(card.punches.length);
    }
  });
});
