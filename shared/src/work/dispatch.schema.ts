import type { BayState } from '../bays/bays.schema.js';
import type { PersonStatus } from '../board/board.schema.js';
import type { PartsHoldDto } from './parts.schema.js';
import type { JobLineDto } from './work.schema.js';

export interface DispatchLine extends Omit<
  JobLineDto,
  'completedAt' | 'completedBy' | 'cause' | 'correction' | 'cancelReason'
> {
  repairOrderNumber: string;
  vehicle: string;
  queuedAt: string;
  clockedSeconds: number;
  /** Technicians clocked on it now. */
  clockedOn: number[];
  /** What it waits for while held for parts; null otherwise. */
  parts: PartsHoldDto | null;
  /**
   * Expected start and finish in the technician's queue (for a waiting line: if started now at the
   * shop's pace); null while held (except for parts with a known arrival: it starts no earlier) or
   * when the shop has no opening hours.
   */
  forecast: { startAt: string; finishAt: string; late: boolean } | null;
  /** Late by the one definition (`isLineLate`): what `lateCount`, the wall and the RO pages count. */
  late: boolean;
}

export interface DispatchLane {
  technician: { id: number; name: string; skillLevel: number; status: PersonStatus | 'off' };
  /**
   * Flagged ÷ clocked hours over the last four weeks; null until the technician has enough clocked
   * time, when forecasts use the shop's figure.
   */
  efficiency: number | null;
  lines: DispatchLine[];
  finishAt: string | null;
}

export interface DispatchBoard {
  serverTime: string;
  /** Lines with nobody to do them: unassigned, or assigned to someone no longer an active technician. */
  queue: DispatchLine[];
  lanes: DispatchLane[];
  /** Each bay with the RO it holds (being worked on, or parked for a final check or pick-up). */
  bays: { id: number; name: string; state: BayState; repairOrderId: number | null }[];
  lateCount: number;
  /** Why there are no forecasts, in plain words; null when there are. */
  forecastNote: string | null;
}
