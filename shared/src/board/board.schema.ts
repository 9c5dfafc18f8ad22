import type { BayState, HoldReason } from '../bays/bays.schema.js';
import type { KioskQueueNote } from '../punches/offline-punches.schema.js';
import type { JobLineStatus, Priority } from '../work/work.schema.js';
import type { TimerEstimateDto, TimerKind } from '../timers/timers.schema.js';
import type { ClockFormat } from '../shop/shop.schema.js';

export interface BoardPersonRef {
  id: number;
  /** First name and initial only: a wall screen never shows more. */
  name: string;
}

export interface BoardTimer {
  id: number;
  kind: TimerKind;
  startedAt: string;
  targetC: number | null;
  lastReadingC: number | null;
  /** Set times end at a known time; temperature timers carry the estimator's answer. */
  endsAt: string | null;
  etaAt: string | null;
  reached: boolean;
  note: string | null;
  /** 'not-enough-readings', 'moving-away' and 'beyond-asymptote' say why there is no ETA. */
  status: TimerEstimateDto['status'];
  confidence: TimerEstimateDto['confidence'];
}

export interface BoardBay {
  id: number;
  name: string;
  state: BayState;
  holdReason: HoldReason | null;
  heldSince: string | null;
  /** Held for parts: when they are expected, if the office said; the wall shows "late" after it. */
  partsDueAt: string | null;
  vehicle: string | null;
  repairOrder: { id: number; number: string } | null;
  jobLine: { id: number; lineNo: number; title: string; status: JobLineStatus } | null;
  technicians: BoardPersonRef[];
  clockedSeconds: number;
  bookSeconds: number;
  /** Clocked time is counted up to `asOf`; an open interval keeps running after it. */
  clockRunning: boolean;
  timer: BoardTimer | null;
}

export const PERSON_STATUSES = ['on-job', 'idle', 'on-break'] as const;
export type PersonStatus = (typeof PERSON_STATUSES)[number];

export interface BoardPerson extends BoardPersonRef {
  status: PersonStatus;
  since: string;
  bayName: string | null;
  jobLineTitle: string | null;
}

export interface BoardQueueItem {
  jobLineId: number;
  repairOrderNumber: string;
  title: string;
  priority: Priority;
  waitingSince: string;
}

export interface BoardSnapshot {
  seq: number;
  serverTime: string;
  shop: { name: string; timeZone: string; clockFormat: ClockFormat };
  bays: BoardBay[];
  people: BoardPerson[];
  queue: BoardQueueItem[];
  /** Open lines forecast to finish after their promised time. */
  lateLines: number;
  /** Kiosks that last said punches wait on them; empty when none. */
  kioskQueues: KioskQueueNote[];
}
