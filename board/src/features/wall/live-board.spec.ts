import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import type { BoardSnapshot } from '@baytime/shared';
import { createLiveBoard, type LiveBoardOptions } from './live-board';

type Handler = (...args: unknown[]) => void;

/** Just enough of a socket.io client socket: the test plays the server. */
class FakeSocket {
  connected = false;
  active = true;
  connects = 0;
  handlers = new Map<string, Set<Handler>>();
  snapshotRequests: ((error: Error | null, snapshot: BoardSnapshot) => void)[] = [];

  on(event: string, handler: Handler) {
    if (!this.handlers.has(event)) this.handlers.set(event, new Set());
    this.handlers.get(event)?.add(handler);
    return this;
  }
  off(event: string, handler: Handler) {
    this.handlers.get(event)?.delete(handler);
    return this;
  }
  connect() {
    this.connects += 1;
    return this;
  }
  disconnect() {
    this.connected = false;
    return this;
  }
  timeout() {
    return {
      emit: (_event: string, ack: (error: Error | null, snapshot: BoardSnapshot) => void) => {
        this.snapshotRequests.push(ack);
      },
    };
  }
  /** The server sends an event. */
  serve(event: string, ...args: unknown[]) {
    if (event === 'connect') this.connected = true;
    if (event === 'disconnect') this.connected = false;
    for (const handler of this.handlers.get(event) ?? []) handler(...args);
  }
}

const snap = (seq: number, state: 'free' | 'working' = 'free'): BoardSnapshot => ({
  seq,
  serverTime: '2026-03-02T15:00:00.000Z',
  shop: { name: 'Test Shop', timeZone: 'UTC' },
  bays: [
    {
      id: 1,
      name: 'Bay 1',
      state,
      holdReason: null,
      heldSince: null,
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
});

describe(createLiveBoard.name, () => {
  let socket: FakeSocket;
  let onUnauthorized: ReturnType<typeof vi.fn<() => void>>;
  const make = (extra: Partial<LiveBoardOptions> = {}) =>
    createLiveBoard({
      socket: socket as unknown as LiveBoardOptions['socket'],
      onUnauthorized,
      now: () => Date.parse('2026-03-02T15:00:00.000Z'),
      ...extra,
    });

  beforeEach(() => {
    vi.useFakeTimers();
    socket = new FakeSocket();
    onUnauthorized = vi.fn<() => void>();
  });
  afterEach(() => vi.useRealTimers());

  it('connects on start, goes live and takes the snapshot the server sends', () => {
    const sut = make();
    sut.start();
    expect(socket.connects).toBe(1);
    socket.serve('connect');
    socket.serve('board.snapshot', snap(5));
    expect(sut.getState().link).toBe('live');
    expect(sut.getState().board?.seq).toBe(5);
    expect(socket.snapshotRequests).toHaveLength(0);
  });

  it('applies events in order and asks for a snapshot after a gap', () => {
    const sut = make();
    sut.start();
    socket.serve('connect');
    socket.serve('board.snapshot', snap(5));
    socket.serve('bay.updated', { seq: 6, bay: { ...snap(0, 'working').bays[0] } });
    expect(sut.getState().board?.snapshot.bays[0]?.state).toBe('working');
    socket.serve('punch.recorded', { seq: 7, punch: {} });
    expect(sut.getState().board?.seq).toBe(7);
    socket.serve('bay.updated', { seq: 9, bay: { ...snap(0).bays[0] } });
    expect(sut.getState().board?.snapshot.bays[0]?.state).toBe('working');
    expect(socket.snapshotRequests).toHaveLength(1);
    // A second gap while the answer is on its way does not ask twice.
    socket.serve('bay.updated', { seq: 10, bay: { ...snap(0).bays[0] } });
    expect(socket.snapshotRequests).toHaveLength(1);
    socket.snapshotRequests[0]?.(null, snap(10));
    expect(sut.getState().board?.seq).toBe(10);
    expect(sut.getState().board?.snapshot.bays[0]?.state).toBe('free');
  });

  it('marks the link down on a drop and asks for a fresh snapshot on reconnect', () => {
    const sut = make();
    sut.start();
    socket.serve('connect');
    socket.serve('board.snapshot', snap(5));
    socket.serve('disconnect', 'transport close');
    expect(sut.getState().link).toBe('down');
    expect(sut.getState().downSince).not.toBeNull();
    socket.serve('connect');
    expect(sut.getState()).toMatchObject({ link: 'live', downSince: null });
    expect(socket.snapshotRequests).toHaveLength(1);
  });

  it('reconnects by itself after the server closed the connection', () => {
    const sut = make();
    sut.start();
    socket.serve('connect');
    socket.serve('disconnect', 'io server disconnect');
    expect(socket.connects).toBe(1);
    vi.advanceTimersByTime(20_000);
    expect(socket.connects).toBe(2);
    sut.stop();
  });

  it('gives the token up on auth.error and stops', () => {
    const sut = make();
    sut.start();
    socket.serve('connect');
    socket.serve('session.ended', { message: 'Unauthorized' });
    expect(onUnauthorized).toHaveBeenCalledTimes(1);
    expect(socket.connected).toBe(false);
    sut.start();
    expect(socket.connects).toBe(1);
  });

  it('checks over HTTP before giving up on a handshake refusal', async () => {
    const checkToken = vi.fn().mockResolvedValueOnce(true).mockResolvedValueOnce(false);
    const sut = make({ checkToken });
    sut.start();
    socket.active = false;
    socket.serve('connect_error', new Error('Unauthorized'));
    await vi.waitFor(() => expect(checkToken).toHaveBeenCalledTimes(1));
    expect(onUnauthorized).not.toHaveBeenCalled();
    socket.serve('connect_error', new Error('Unauthorized'));
    await vi.waitFor(() => expect(onUnauthorized).toHaveBeenCalledTimes(1));
    sut.stop();
  });

  it('tells subscribers about changes and stops listening when stopped', () => {
    const sut = make();
    const listener = vi.fn();
    const unsubscribe = sut.subscribe(listener);
    sut.start();
    socket.serve('connect');
    expect(listener).toHaveBeenCalled();
    unsubscribe();
    sut.stop();
    listener.mockClear();
    socket.serve('board.snapshot', snap(1));
    expect(listener).not.toHaveBeenCalled();
    expect(sut.getState().board).toBeNull();
  });
});
