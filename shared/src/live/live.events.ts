import type { AnswerChannel } from '../approvals/approvals.schema.js';
import type { BoardBay, BoardPerson, BoardQueueItem, BoardSnapshot } from '../board/board.schema.js';
import type { KioskQueueNote } from '../punches/offline-punches.schema.js';
import type { PunchDto } from '../punches/punches.schema.js';
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
    event: Sequenced & { findingId: number; answer: 'approved' | 'declined'; channel: AnswerChannel },
  ) => void;
  /** The RO itself changed: edited, closed, a notice sent, an answer recorded, a final check. */
  'repair-order.updated': (event: Sequenced & { repairOrderId: number }) => void;
  /** The server ended this connection: the token expired, or its screen or account was changed. */
  'session.ended': (refusal: LiveRefusal) => void;
}

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
  'screen-revoked',
] as const;
export type LiveRefusalReason = (typeof LIVE_REFUSAL_REASONS)[number];

export interface LiveRefusal {
  reason: LiveRefusalReason;
  message: string;
}

export const LIVE_REFUSAL_WORDS: Record<LiveRefusalReason, string> = {
  'token-missing': 'Sign in first',
  'token-invalid': 'This sign-in is not valid here: sign in again',
  'token-expired': 'Your sign-in ran out: sign in again',
  'token-no-expiry': 'This sign-in has no expiry and is not accepted: sign in again',
  'account-inactive': 'This account is no longer active',
  'role-changed': 'Your role changed: sign in again',
  'screen-revoked': 'This screen was unpaired in the office: pair it again',
};

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
