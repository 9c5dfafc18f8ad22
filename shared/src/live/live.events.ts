import { LIVE_REFUSAL_WORDS } from '../words/connection-words.js';
import type { AnswerChannel } from '../approvals/approvals.schema.js';
import type { BoardBay, BoardPerson, BoardQueueItem, BoardSnapshot } from '../board/board.schema.js';
import type { KioskQueueNote } from '../punches/offline-punches.schema.js';
import type { PunchDto } from '../punches/punches.schema.js';
import type { ShopSettings } from '../shop/shop.schema.js';
import type { JobLineDto } from '../work/work.schema.js';

/** Every live message carries the shop-wide `seq`; a client that sees a gap asks for a snapshot. */
export interface Sequenced {
  seq: number;
}

export interface ServerToClientEvents {
  'board.snapshot': (snapshot: BoardSnapshot) => void;
  'bay.updated': (event: Sequenced & { bay: BoardBay }) => void;
  /**
   * People, queue and late count; `bayIds` is the wall's bays in order: a bay missing from it was
   * retired, and a new one follows its own `bay.updated`.
   */
  'floor.updated': (
    event: Sequenced & {
      people: BoardPerson[];
      queue: BoardQueueItem[];
      lateLines: number;
      bayIds: number[];
      kioskQueues: KioskQueueNote[];
    },
  ) => void;
  'punch.recorded': (event: Sequenced & { punch: PunchDto }) => void;
  'job-line.updated': (event: Sequenced & { jobLine: JobLineDto }) => void;
  'timer.updated': (event: Sequenced & { timerId: number; bayId: number | null }) => void;
  'finding.created': (event: Sequenced & { findingId: number; jobLineId: number }) => void;
  /** A customer's answer was recorded, through the approval link or by the office. */
  'finding.answered': (
    event: Sequenced & {
      findingId: number;
      /** The line the finding was raised on. */
      jobLineId: number;
      /** What the technician wrote: the tablet's notice says which finding was answered. */
      note: string;
      answer: 'approved' | 'declined';
      channel: AnswerChannel;
    },
  ) => void;
  /**
   * The RO itself changed: edited, closed, a notice sent (ready notice, approval request), a link
   * withdrawn, a quote saved, an answer recorded, a final check.
   */
  'repair-order.updated': (event: Sequenced & { repairOrderId: number }) => void;
  /** The owner saved the shop settings: every app reads them again (kiosks: split rule, idle sign-out). */
  'shop.updated': (event: Sequenced & { shop: ShopSettings }) => void;
  /** The server ended this connection: the token expired, or its screen or account was changed. */
  'session.ended': (refusal: LiveRefusal) => void;
}

export type LiveEventName = keyof ServerToClientEvents;

/** Every server event by name, at run time; a new event in the map fails to compile until it is here. */
export const LIVE_EVENT_NAMES = Object.keys({
  'board.snapshot': true,
  'bay.updated': true,
  'floor.updated': true,
  'punch.recorded': true,
  'job-line.updated': true,
  'timer.updated': true,
  'finding.created': true,
  'finding.answered': true,
  'repair-order.updated': true,
  'shop.updated': true,
  'session.ended': true,
} satisfies Record<LiveEventName, true>) as LiveEventName[];

export interface ClientToServerEvents {
  'board.snapshot': (ack: (snapshot: BoardSnapshot) => void) => void;
}

/**
 * Why the server refused a live connection (the `data` of the client's `connect_error`) or ended
 * one (`session.ended`). Each says what the client should do: sign in again, or pair the screen again.
 */
export const LIVE_REFUSAL_REASONS = [
  'token-missing',
  'token-invalid',
  'token-expired',
  'token-no-expiry',
  'account-inactive',
  'role-changed',
  'credentials-changed',
  'screen-revoked',
] as const;
export type LiveRefusalReason = (typeof LIVE_REFUSAL_REASONS)[number];

export interface LiveRefusal {
  reason: LiveRefusalReason;
  message: string;
}

export function liveRefusal(reason: LiveRefusalReason): LiveRefusal {
  return { reason, message: LIVE_REFUSAL_WORDS[reason] };
}

/** The refusal a `connect_error` or `session.ended` carries, or null for anything else (a network error). */
export function readLiveRefusal(data: unknown): LiveRefusal | null {
  const reason = (data as { reason?: unknown } | null)?.reason;
  return (LIVE_REFUSAL_REASONS as readonly unknown[]).includes(reason)
    ? liveRefusal(reason as LiveRefusalReason)
    : null;
}

/** Applies one sequenced event: true when it follows `lastSeq` directly, false when one was missed. */
export function followsDirectly(lastSeq: number, event: Sequenced): boolean {
  return event.seq === lastSeq + 1;
}
