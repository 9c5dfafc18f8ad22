import type { BoardBay, BoardPerson, BoardQueueItem, BoardSnapshot } from '../board/board.schema.js';
import type { PunchDto } from '../punches/punches.schema.js';
import type { JobLineDto } from '../work/work.schema.js';

/** Every live message carries the shop-wide `seq`; a client that sees a gap asks for a snapshot. */
export interface Sequenced {
  seq: number;
}

export interface ServerToClientEvents {
  'board.snapshot': (snapshot: BoardSnapshot) => void;
  'bay.updated': (event: Sequenced & { bay: BoardBay }) => void;
  'floor.updated': (
    event: Sequenced & { people: BoardPerson[]; queue: BoardQueueItem[]; lateLines: number },
  ) => void;
  'punch.recorded': (event: Sequenced & { punch: PunchDto }) => void;
  'job-line.updated': (event: Sequenced & { jobLine: JobLineDto }) => void;
  'timer.updated': (event: Sequenced & { timerId: number; bayId: number | null }) => void;
  'finding.created': (event: Sequenced & { findingId: number; jobLineId: number }) => void;
  'auth.error': (event: { message: string }) => void;
}

export interface ClientToServerEvents {
  'board.snapshot': (ack: (snapshot: BoardSnapshot) => void) => void;
}

/** Applies one sequenced event: true when it follows `lastSeq` directly, false when one was missed. */
export function followsDirectly(lastSeq: number, event: Sequenced): boolean {
  return event.seq === lastSeq + 1;
}
