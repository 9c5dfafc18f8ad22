import { describe, expect, it, vi } from 'vitest';
import type { BoardSnapshot } from '../board/board.schema.js';
import { liveRefusal } from '../live/live.events.js';
import { createLiveLink, type LiveSocket } from './live-link.js';

type Handler = (...args: never[]) => void;
type Ack = (error: Error | null, snapshot: BoardSnapshot) => void;

/** Just enough of a socket.io client socket: the test plays the server. */
class FakeSocket implements LiveSocket {
  connected = false;
  connects = 0;
  disconnects = 0;
  handlers = new Map<string, Set<Handler>>();
  requests: Ack[] = [];

  on(event: string, handler: Handler) {
    if (!this.handlers.has(event)) this.handlers.set(event, new Set());
    this.handlers.get(event)?.add(handler);
  }
  off(event: string, handler: Handler) {
    this.handlers.get(event)?.delete(handler);
  }
  connect() {
    this.connects += 1;
  }
  disconnect() {
    this.disconnects += 1;
    this.connected = false;
  }
  timeout() {
    return { emit: (_event: 'board.snapshot', ack: Ack) => void this.requests.push(ack) };
  }
  /** The server (or the socket itself) fires an event. */
  serve(event: string, ...args: unknown[]) {
    if (event === 'connect') this.connected = true;
    if (event === 'disconnect') this.connected = false;
    for (const handler of this.handlers.get(event) ?? []) (handler as (...a: unknown[]) => void)(...args);
  }
  listeners(event: string) {
    return this.handlers.get(event)?.size ?? 0;
  }
}

const refusedError = (reason: Parameters<typeof liveRefusal>[0]) =>
  Object.assign(new Error('refused'), { data: liveRefusal(reason) });

function setUp() {
  const socket = new FakeSocket();
  const onRefused = vi.fn();
  const sut = createLiveLink({ socket, onRefused, now: () => 1_000 });
  return { socket, onRefused, sut };
}

describe(createLiveLink.name, () => {
  it('connects on start, goes live, and tells listeners after a reconnect only', () => {
    const { socket, sut } = setUp();
    const reconnected = vi.fn();
    sut.onReconnect(reconnected);
    sut.start();
    expect(socket.connects).toBe(1);
    expect(sut.getState().status).toBe('connecting');
    socket.serve('connect');
    expect(sut.getState()).toEqual({ status: 'live', downSince: null, refusal: null });
    expect(reconnected).not.toHaveBeenCalled();
    socket.serve('disconnect', 'transport close');
    expect(sut.getState()).toMatchObject({ status: 'down', downSince: 1_000 });
    socket.serve('connect');
    expect(reconnected).toHaveBeenCalledTimes(1);
  });

  it('leaves a network error to Socket.IO, which retries by itself', () => {
    const { socket, onRefused, sut } = setUp();
    sut.start();
    socket.serve('connect_error', new Error('xhr poll error'));
    expect(sut.getState().status).toBe('down');
    expect(onRefused).not.toHaveBeenCalled();
    expect(socket.connects).toBe(1);
  });

  it('stops for good on a handshake refusal and passes the reason on', () => {
    const { socket, onRefused, sut } = setUp();
    sut.start();
    socket.serve('connect_error', refusedError('token-expired'));
    expect(onRefused).toHaveBeenCalledWith(liveRefusal('token-expired'));
    expect(sut.getState()).toMatchObject({ status: 'refused', refusal: { reason: 'token-expired' } });
    expect(socket.disconnects).toBe(1);
    expect(socket.listeners('connect_error')).toBe(0);
    sut.start();
    expect(socket.connects).toBe(1);
  });

  it('stops when the server ends the session, and does not reconnect after its disconnect', () => {
    const { socket, onRefused, sut } = setUp();
    sut.start();
    socket.serve('connect');
    socket.serve('session.ended', liveRefusal('screen-revoked'));
    socket.serve('disconnect', 'io server disconnect');
    expect(onRefused).toHaveBeenCalledTimes(1);
    expect(onRefused).toHaveBeenCalledWith(liveRefusal('screen-revoked'));
    expect(socket.connects).toBe(1);
  });

  it('asks the handshake again when the server closed the link without a reason', () => {
    const { socket, sut } = setUp();
    sut.start();
    socket.serve('connect');
    socket.serve('disconnect', 'io server disconnect');
    expect(socket.connects).toBe(2);
  });

  it('answers a snapshot request with the snapshot, or null when down or unanswered', async () => {
    const { socket, sut } = setUp();
    sut.start();
    await expect(sut.requestSnapshot()).resolves.toBeNull();
    socket.serve('connect');
    const answered = sut.requestSnapshot();
    socket.requests[0]?.(null, { seq: 7 } as BoardSnapshot);
    await expect(answered).resolves.toEqual({ seq: 7 });
    const unanswered = sut.requestSnapshot();
    socket.requests[1]?.(new Error('operation has timed out'), undefined as never);
    await expect(unanswered).resolves.toBeNull();
  });

  it('keeps event listeners across a close and a start, until they are removed', () => {
    const { socket, sut } = setUp();
    const heard = vi.fn();
    const off = sut.on('timer.updated', heard);
    sut.start();
    sut.close();
    expect(socket.listeners('timer.updated')).toBe(0);
    sut.start();
    socket.serve('timer.updated', { seq: 1, timerId: 2, bayId: null });
    expect(heard).toHaveBeenCalledTimes(1);
    off();
    socket.serve('timer.updated', { seq: 2, timerId: 2, bayId: null });
    expect(heard).toHaveBeenCalledTimes(1);
  });
});
