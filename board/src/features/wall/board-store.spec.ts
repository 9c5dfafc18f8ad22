import { describe, expect, it } from 'vitest';
import type { BoardBay, BoardSnapshot } from '@baytime/shared';
import { applyEvent, boardFromSnapshot, clockedSecondsAt } from './board-store';

const bay = (id: number, patch: Partial<BoardBay> = {}): BoardBay => ({
  id,
  name: `Bay ${id}`,
  state: 'free',
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
  ...patch,
});

const snapshot = (seq: number, serverTime = '2026-03-02T15:00:00.000Z'): BoardSnapshot => ({
  seq,
  serverTime,
  shop: { name: 'Test Shop', timeZone: 'America/Chicago', clockFormat: '12h' },
  bays: [bay(1), bay(2)],
  people: [],
  queue: [],
  lateLines: 0,
  kioskQueues: [],
});

describe(boardFromSnapshot.name, () => {
  it('takes the seq and the clock offset from the snapshot', () => {
    const local = Date.parse('2026-03-02T14:58:00.000Z');
    const sut = boardFromSnapshot(snapshot(7), local);
    expect(sut.seq).toBe(7);
    expect(sut.clock.offsetMs).toBe(120_000);
    expect(sut.bayAsOf[1]).toBe(Date.parse('2026-03-02T15:00:00.000Z'));
  });
});

describe(applyEvent.name, () => {
  const local = Date.parse('2026-03-02T15:00:00.000Z');
  const start = () => boardFromSnapshot(snapshot(10), local);

  it('applies a bay update that follows the last seq directly', () => {
    const result = applyEvent(
      start(),
      { type: 'bay.updated', seq: 11, bay: bay(2, { state: 'working' }) },
      local + 5000,
    );
    expect(result.resync).toBe(false);
    expect(result.board?.seq).toBe(11);
    expect(result.board?.snapshot.bays[1]?.state).toBe('working');
    expect(result.board?.snapshot.bays[0]?.state).toBe('free');
    expect(result.board?.bayAsOf[2]).toBe(local + 5000);
  });

  it('asks for a snapshot when a seq was skipped, and changes nothing', () => {
    const board = start();
    const result = applyEvent(
      board,
      { type: 'bay.updated', seq: 12, bay: bay(2, { state: 'working' }) },
      local,
    );
    expect(result.resync).toBe(true);
    expect(result.board).toBe(board);
  });

  it('ignores an event it has already seen', () => {
    const board = start();
    const result = applyEvent(board, { type: 'bay.updated', seq: 10, bay: bay(2, { state: 'held' }) }, local);
    expect(result).toEqual({ board, resync: false });
  });

  it('replaces people and queue on a floor update', () => {
    const people = [
      {
        id: 4,
        name: 'Dana O.',
        status: 'idle' as const,
        since: '2026-03-02T14:00:00Z',
        bayName: null,
        jobLineTitle: null,
      },
    ];
    const result = applyEvent(
      start(),
      { type: 'floor.updated', seq: 11, people, queue: [], lateLines: 2, bayIds: [1, 2], kioskQueues: [] },
      local,
    );
    expect(result.board?.snapshot.people).toEqual(people);
    expect(result.board?.snapshot.lateLines).toBe(2);
  });

  it('moves the seq on for events that do not change the board', () => {
    const result = applyEvent(start(), { type: 'other', seq: 11 }, local);
    expect(result.board?.seq).toBe(11);
    expect(result.resync).toBe(false);
  });

  it('places a new bay where the floor update that follows puts it', () => {
    const added = applyEvent(start(), { type: 'bay.updated', seq: 11, bay: bay(9) }, local);
    expect(added.resync).toBe(false);
    const placed = applyEvent(
      added.board,
      {
        type: 'floor.updated',
        seq: 12,
        people: [],
        queue: [],
        lateLines: 0,
        bayIds: [9, 1, 2],
        kioskQueues: [],
      },
      local,
    );
    expect(placed.board?.snapshot.bays.map((b) => b.id)).toEqual([9, 1, 2]);
  });

  it('drops a retired bay and reorders the rest on a floor update', () => {
    const result = applyEvent(
      start(),
      { type: 'floor.updated', seq: 11, people: [], queue: [], lateLines: 0, bayIds: [2], kioskQueues: [] },
      local,
    );
    expect(result.board?.snapshot.bays.map((b) => b.id)).toEqual([2]);
    expect(result.resync).toBe(false);
  });

  it('asks for a snapshot for an order naming a bay it does not know, or when it has none', () => {
    const unknown = applyEvent(
      start(),
      {
        type: 'floor.updated',
        seq: 11,
        people: [],
        queue: [],
        lateLines: 0,
        bayIds: [1, 2, 9],
        kioskQueues: [],
      },
      local,
    );
    expect(unknown).toMatchObject({ resync: true, board: { seq: 10 } });
    expect(applyEvent(null, { type: 'other', seq: 1 }, local)).toEqual({ board: null, resync: true });
  });

  it('takes a snapshot with a lower seq after a server restart', () => {
    const later = boardFromSnapshot(snapshot(3), local);
    expect(later.seq).toBe(3);
    expect(applyEvent(later, { type: 'other', seq: 4 }, local).board?.seq).toBe(4);
  });
});

describe(clockedSecondsAt.name, () => {
  it('keeps counting an open interval after asOf, and stops a closed one', () => {
    const asOf = Date.parse('2026-03-02T15:00:00Z');
    expect(clockedSecondsAt(bay(1, { clockedSeconds: 600, clockRunning: true }), asOf, asOf + 90_500)).toBe(
      690,
    );
    expect(clockedSecondsAt(bay(1, { clockedSeconds: 600, clockRunning: false }), asOf, asOf + 90_500)).toBe(
      600,
    );
  });
});
