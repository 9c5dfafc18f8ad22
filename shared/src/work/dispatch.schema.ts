import type { BayState } from '../bays/bays.schema.js';
import type { PersonStatus } from '../board/board.schema.js';
import type { JobLineDto } from './work.schema.js';

export interface DispatchLine extends Omit<JobLineDto, 'completedAt'> {
  repairOrderNumber: string;
  vehicle: string;
  queuedAt: string;
  clockedSeconds: number;
  /** Technicians clocked on it now. */
  clockedOn: number[];
  /** Expected start and finish in the technician's queue; null while unassigned or held. */
  forecast: { startAt: string; finishAt: string; late: boolean } | null;
}

export interface DispatchLane {
  technician: { id: number; name: string; skillLevel: number; status: PersonStatus | 'off' };
  /** Flagged ÷ clocked hours over the last four weeks; null for a technician with no history yet. */
  efficiency: number | null;
  lines: DispatchLine[];
  finishAt: string | null;
}

export interface DispatchBoard {
  serverTime: string;
  queue: DispatchLine[];
  lanes: DispatchLane[];
  bays: { id: number; name: string; state: BayState }[];
  lateCount: number;
}
