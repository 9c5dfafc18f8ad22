import {
  followsDirectly,
  type BoardBay,
  type BoardPerson,
  type BoardQueueItem,
  type KioskQueueNote,
  type BoardSnapshot,
} from '@baytime/shared';
import { clockFromServerTime, serverNow, type ServerClock } from './server-clock';

/** What the board shows, plus what it needs to keep it true: the last applied `seq` and the clock. */
export interface BoardData {
  snapshot: BoardSnapshot;
  seq: number;
  clock: ServerClock;
  /** Server time (ms) up to which each bay's `clockedSeconds` was counted, by bay id. */
  bayAsOf: Readonly<Record<number, number>>;
}

export type BoardEvent =
  | { type: 'bay.updated'; seq: number; bay: BoardBay }
  | {
      type: 'floor.updated';
      seq: number;
      people: BoardPerson[];
      queue: BoardQueueItem[];
      lateLines: number;
      bayIds: number[];
      kioskQueues: KioskQueueNote[];
    }
  /** A sequenced event that does not change what the board shows by itself (punch, job line, …). */
  | { type: 'other'; seq: number };

export interface ApplyResult {
  board: BoardData | null;
  /** A message was missed (or the event cannot be placed): ask the server for a fresh snapshot. */
  resync: boolean;
}

/** A snapshot replaces everything, whatever its `seq`: after a server restart the count starts again. */
export function boardFromSnapshot(snapshot: BoardSnapshot, receivedAtLocalMs: number): BoardData {
  const asOf = Date.parse(snapshot.serverTime);
  const clock = clockFromServerTime(snapshot.serverTime, receivedAtLocalMs);
  const at = Number.isFinite(asOf) ? asOf : serverNow(clock, receivedAtLocalMs);
  const bayAsOf: Record<number, number> = {};
  for (const bay of snapshot.bays) bayAsOf[bay.id] = at;
  return { snapshot, seq: snapshot.seq, clock, bayAsOf };
}

export function applyEvent(
  board: BoardData | null,
  event: BoardEvent,
  receivedAtLocalMs: number,
): ApplyResult {
  if (!board) return { board, resync: true };
  if (event.seq <= board.seq) return { board, resync: false };
  if (!followsDirectly(board.seq, event)) return { board, resync: true };

  switch (event.type) {
    case 'bay.updated': {
      const index = board.snapshot.bays.findIndex((bay) => bay.id === event.bay.id);
      // A new bay goes last for now: the `floor.updated` that follows puts it in its place.
      const bays = board.snapshot.bays.slice();
      bays.splice(index < 0 ? bays.length : index, index < 0 ? 0 : 1, event.bay);
      return {
        board: {
          ...board,
          seq: event.seq,
          snapshot: { ...board.snapshot, bays },
          // Events carry no server time: the bay's totals are as of its arrival, on the server's clock.
          bayAsOf: { ...board.bayAsOf, [event.bay.id]: serverNow(board.clock, receivedAtLocalMs) },
        },
        resync: false,
      };
    }
    case 'floor.updated': {
      const known = new Map(board.snapshot.bays.map((bay) => [bay.id, bay]));
      // A bay in the order that the board never heard of: only a snapshot can show it.
      if (event.bayIds.some((id) => !known.has(id))) return { board, resync: true };
      return {
        board: {
          ...board,
          seq: event.seq,
          snapshot: {
            ...board.snapshot,
            bays: event.bayIds.map((id) => known.get(id)!),
            people: event.people,
            queue: event.queue,
            lateLines: event.lateLines,
            kioskQueues: event.kioskQueues,
          },
        },
        resync: false,
      };
    }
    case 'other':
      return { board: { ...board, seq: event.seq }, resync: false };
  }
}

/** A bay's clocked seconds at `nowMs` (server time): the open interval keeps running after `asOf`. */
export function clockedSecondsAt(bay: BoardBay, asOfMs: number | undefined, nowMs: number): number {
  if (!bay.clockRunning || asOfMs === undefined) return bay.clockedSeconds;
  return bay.clockedSeconds + Math.max(0, Math.floor((nowMs - asOfMs) / 1000));
}
