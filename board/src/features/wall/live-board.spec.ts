import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { LIVE_EVENT_NAMES, liveRefusal, type BoardSnapshot } from '@baytime/shared';
import type { LinkState, LiveLink } from '@baytime/shared/client';
import { createLiveBoard } from './live-board';

type Handler = (payload: never) => void;

/** A live link the test drives: it plays the server and the connection. */
class FakeLink implements LiveLink {
  state: LinkState = { status: 'connecting', downSince: 0, refusal: null };
  handlers = new Map<string, Set<Handler>>();
  reconnectListeners = new Set<() => void>();
  stateListeners = new Set<() => void>();
  requests: ((snapshot: BoardSnapshot | null) => void)[] = [];

  on(event: string, handler: Handler) {
    if (!this.handlers.has(event)) this.handlers.set(event, new Set());
    this.handlers.get(event)?.add(handler);
    return () => void this.handlers.get(event)?.delete(handler);
  }
  onReconnect(listener: () => void) {
    this.reconnectListeners.add(listener);
    return () => void this.reconnectListeners.delete(listener);
  }
  getState = () => this.state;
  subscribe(listener: () => void) {
    this.stateListeners.add(listener);
    return () => void this.stateListeners.delete(listener);
  }
  requestSnapshot() {
    return new Promise<BoardSnapshot | null>((resolve) => this.requests.push(resolve));
  }
  start() {}
  close() {}

  serve(event: string, payload: unknown) {
    for (const handler of this.handlers.get(event) ?? []) handler(payload as never);
  }
  become(patch: Partial<LinkState>) {
    this.state = { ...this.state, ...patch };
    for (const listener of this.stateListeners) listener();
  }
  reconnect() {
    this.become({ status: 'live', downSince: null });
    for (const listener of this.reconnectListeners) listener();
  }
}

const snap = (seq: number, state: 'free' | 'working' = 'free'): BoardSnapshot => ({
  seq,
  serverTime: '2026-03-02T15:00:00.000Z',
  shop: { name: 'Test Shop', timeZone: 'UTC', clockFormat: '12h' },
  bays: [
    {
      id: 1,
      name: 'Bay 1',
      state,
      holdReason: null,
      heldSince: null,
      partsDueAt: null,
      vehicle: null,
      repairOrder: null,
      jobLine: null,
      technicians: [],
      clockedSeconds: 0,
      bookSeconds: 0,
      clockRunning: false,
      timer: null,
    },
  ],
  people: [],
  queue: [],
  lateLines: 0,
  kioskQueues: [],
});

describe(createLiveBoard.name, () => {
  let link: FakeLink;
  const make = () => createLiveBoard({ link, now: () => Date.parse('2026-03-02T15:00:00.000Z') });

  beforeEach(() => {
    vi.useFakeTimers();
    link = new FakeLink();
  });
  afterEach(() => vi.useRealTimers());

  it('takes the snapshot the server sends on connect and follows the link', () => {
    const sut = make();
    sut.start();
    expect(sut.getState()).toMatchObject({ link: 'connecting', board: null });
    link.become({ status: 'live', downSince: null });
    link.serve('board.snapshot', snap(5));
    expect(sut.getState().link).toBe('live');
    expect(sut.getState().board?.seq).toBe(5);
    expect(link.requests).toHaveLength(0);
  });

  it('applies events in order and asks for a snapshot after a gap', async () => {
    const sut = make();
    sut.start();
    link.become({ status: 'live', downSince: null });
    link.serve('board.snapshot', snap(5));
    link.serve('bay.updated', { seq: 6, bay: { ...snap(0, 'working').bays[0] } });
    expect(sut.getState().board?.snapshot.bays[0]?.state).toBe('working');
    link.serve('punch.recorded', { seq: 7, punch: {} });
    expect(sut.getState().board?.seq).toBe(7);
    link.serve('bay.updated', { seq: 9, bay: { ...snap(0).bays[0] } });
    expect(sut.getState().board?.snapshot.bays[0]?.state).toBe('working');
    expect(link.requests).toHaveLength(1);
    // A second gap while the answer is on its way does not ask twice.
    link.serve('bay.updated', { seq: 10, bay: { ...snap(0).bays[0] } });
    expect(link.requests).toHaveLength(1);
    link.requests[0]?.(snap(10));
    await vi.waitFor(() => expect(sut.getState().board?.seq).toBe(10));
    expect(sut.getState().board?.snapshot.bays[0]?.state).toBe('free');
  });

  it('counts the seq of every event the server sends, so none reads as a gap', () => {
    const sut = make();
    sut.start();
    link.serve('board.snapshot', snap(5));
    const others = LIVE_EVENT_NAMES.filter(
      (event) =>
        !['board.snapshot', 'bay.updated', 'floor.updated', 'shop.updated', 'session.ended'].includes(event),
    );
    others.forEach((event, index) => link.serve(event, { seq: 6 + index }));
    expect(sut.getState().board?.seq).toBe(5 + others.length);
    expect(link.requests).toHaveLength(0);
  });

  it('takes a fresh snapshot after the shop settings change: name and time zone come with it', async () => {
    const sut = make();
    sut.start();
    link.serve('board.snapshot', snap(5));
    link.serve('shop.updated', { seq: 6, shop: {} });
    expect(sut.getState().board?.seq).toBe(6);
    expect(link.requests).toHaveLength(1);
    link.requests[0]?.({ ...snap(6), shop: { name: 'Renamed Shop', timeZone: 'UTC', clockFormat: '12h' } });
    await vi.waitFor(() => expect(sut.getState().board?.snapshot.shop.name).toBe('Renamed Shop'));
  });

  it('asks again at the next gap when a request went unanswered', async () => {
    const sut = make();
    sut.start();
    link.serve('board.snapshot', snap(5));
    link.serve('bay.updated', { seq: 8, bay: { ...snap(0).bays[0] } });
    link.requests[0]?.(null);
    await Promise.resolve();
    link.serve('bay.updated', { seq: 9, bay: { ...snap(0).bays[0] } });
    expect(link.requests).toHaveLength(2);
    expect(sut.getState().board?.seq).toBe(5);
  });

  it('marks the link down on a drop and asks for a fresh snapshot on reconnect', () => {
    const sut = make();
    sut.start();
    link.become({ status: 'live', downSince: null });
    link.serve('board.snapshot', snap(5));
    link.become({ status: 'down', downSince: 1_000 });
    expect(sut.getState()).toMatchObject({ link: 'down', downSince: 1_000 });
    link.reconnect();
    expect(sut.getState()).toMatchObject({ link: 'live', downSince: null });
    expect(link.requests).toHaveLength(1);
  });

  it('asks for a snapshot at once when it starts on a link that is already live', () => {
    link.become({ status: 'live', downSince: null });
    make().start();
    expect(link.requests).toHaveLength(1);
  });

  it('shows why the server refused the token', () => {
    const sut = make();
    sut.start();
    link.become({ status: 'refused', refusal: liveRefusal('token-expired') });
    expect(sut.getState()).toMatchObject({ link: 'refused', refusal: { reason: 'token-expired' } });
  });

  it('tells subscribers about changes and stops listening when stopped', () => {
    const sut = make();
    const listener = vi.fn();
    const unsubscribe = sut.subscribe(listener);
    sut.start();
    link.become({ status: 'live', downSince: null });
    expect(listener).toHaveBeenCalled();
    unsubscribe();
    sut.stop();
    listener.mockClear();
    link.serve('board.snapshot', snap(1));
    expect(listener).not.toHaveBeenCalled();
    expect(sut.getState().board).toBeNull();
  });
});
