import type { HoldReason } from '../bays/bays.schema.js';
import type { PartsHoldDto } from '../work/parts.schema.js';
import type { JobLineStatus, Priority } from '../work/work.schema.js';
import type { BreakKind } from './punches.schema.js';

/** How long My day keeps listing a customer's answer to a finding. */
export const ANSWERED_FINDINGS_HOURS = 24;

export const SHIFT_STATUSES = ['off', 'on-shift', 'on-break'] as const;
export type ShiftStatus = (typeof SHIFT_STATUSES)[number];

export interface MyJobLine {
  id: number;
  repairOrderNumber: string;
  vehicle: string;
  title: string;
  lineNo: number;
  bookHours: number;
  /** Seconds this technician has been clocked on the line, split rule applied, up to `serverTime`. */
  mySeconds: number;
  /** Seconds everyone has been clocked on the line. */
  allSeconds: number;
  status: JobLineStatus;
  holdReason: HoldReason | null;
  priority: Priority;
  bayName: string | null;
  clockedOn: boolean;
  /** The customer's concern for this line, from intake. */
  concern: string;
  /** What the line waits for (held for parts), or the parts just received; null when none. */
  parts: PartsHoldDto | null;
}

/** A bay in `check` holding a vehicle this technician worked on: the road test or final look waits. */
export interface MyFinalCheck {
  bayId: number;
  bayName: string;
  repairOrderNumber: string;
  vehicle: string;
}

/**
 * A customer's answer to a finding on one of this technician's open lines. The kiosk signs out
 * after a minute idle, so the live `finding.answered` event mostly reaches nobody: My day lists the
 * recent answers instead.
 */
export interface MyAnsweredFinding {
  findingId: number;
  jobLineId: number;
  /** What the technician wrote on the finding. */
  note: string;
  answer: 'approved' | 'declined';
  answeredAt: string;
}

/** What the kiosk shows a signed-in technician: `GET /api/me/day`. */
export interface MyDay {
  serverTime: string;
  technician: { id: number; name: string };
  shift: { status: ShiftStatus; since: string | null; breakKind: BreakKind | null };
  openJobLineIds: number[];
  lines: MyJobLine[];
  /** Lines this technician finished since the shop's midnight. */
  doneToday: number;
  finalChecks: MyFinalCheck[];
  /** Answers from the last `ANSWERED_FINDINGS_HOURS` to findings on `lines`, newest first. */
  answeredFindings: MyAnsweredFinding[];
  idleSignOutSeconds: number;
  maxConcurrentJobs: number;
}
