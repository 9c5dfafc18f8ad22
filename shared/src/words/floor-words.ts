import type { BayState, HoldReason } from '../bays/bays.schema.js';
import type { PersonStatus } from '../board/board.schema.js';
import type { ShiftStatus } from '../punches/my-day.schema.js';
import type { TimerKind } from '../timers/timers.schema.js';
import type { JobLineStatus, Priority, RepairOrderStatus } from '../work/work.schema.js';

/** A bay's state as every screen names it, beside its colour and icon. */
export const BAY_STATE_WORDS: Readonly<Record<BayState, string>> = {
  free: 'Free',
  staged: 'Staged',
  working: 'Working',
  timer: 'Timer',
  held: 'Held',
  check: 'Final QC',
  ready: 'Ready',
};

/** A job line's status: one word each, on the wall, the kiosk, the office and in exports. */
export const JOB_LINE_STATUS_WORDS: Readonly<Record<JobLineStatus, string>> = {
  queued: 'Queued',
  working: 'Working',
  held: 'Held',
  done: 'Done',
  cancelled: 'Cancelled',
};

export const REPAIR_ORDER_STATUS_WORDS: Readonly<Record<RepairOrderStatus, string>> = {
  open: 'Open',
  done: 'Work done',
  closed: 'Closed',
};

/** Why a line is held, short enough for a tag: "Held: Parts". */
export const HOLD_REASON_LABELS: Readonly<Record<HoldReason, string>> = {
  parts: 'Parts',
  approval: 'Approval',
  tooling: 'Tooling',
  sublet: 'Sublet',
  other: 'Other',
};

/** A held line with its reason, "Held: Parts"; any other status in its one word. */
export function lineStatusWords(line: { status: JobLineStatus; holdReason?: HoldReason | null }): string {
  return line.status === 'held' && line.holdReason
    ? `${JOB_LINE_STATUS_WORDS.held}: ${HOLD_REASON_LABELS[line.holdReason]}`
    : JOB_LINE_STATUS_WORDS[line.status];
}

/**
 * A timer's kind. The fixed wait (a sealant's cure, a soak) is a "Set time": a name that cannot be read
 * as a held line or a held bay.
 */
export const TIMER_KIND_LABELS: Readonly<Record<TimerKind, string>> = {
  'warm-up': 'Warm-up',
  'cool-down': 'Cool-down',
  'set-time': 'Set time',
};

/** What a technician is doing, as the wall and the office name it. */
export const PERSON_STATUS_WORDS: Readonly<Record<PersonStatus | ShiftStatus, string>> = {
  'on-job': 'On a job',
  idle: 'Idle',
  'on-break': 'On break',
  'on-shift': 'On shift',
  off: 'Off shift',
};

export const PRIORITY_WORDS: Readonly<Record<Priority, string>> = {
  urgent: 'Urgent',
  high: 'High',
  normal: 'Normal',
  low: 'Low',
};

/** A job line by its number within its repair order: "line 2". */
export function lineWords(lineNo: number): string {
  return `line ${lineNo}`;
}

/** A repair order's line: "RO 4417 line 2". */
export function repairOrderLineWords(repairOrderNumber: string | number, lineNo: number): string {
  return `RO ${repairOrderNumber} ${lineWords(lineNo)}`;
}

/** A technician's or an operation's skill level: "skill 3". */
export function skillWords(level: number): string {
  return `skill ${level}`;
}

/** A forecast or estimate, never shown as exact: "about 2:30 pm". */
export function aboutWords(text: string): string {
  return `about ${text}`;
}

/** A job line by number and title, inside a sentence: line 2 “Replace brake pads”. */
export function lineWithTitleWords(lineNo: number, title: string): string {
  return `${lineWords(lineNo)} “${title}”`;
}
