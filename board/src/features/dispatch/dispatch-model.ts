import {
  inSentence,
  PRIORITY_WORDS,
  repairOrderLineWords,
  type DispatchBoard,
  type DispatchLane,
  type DispatchLine,
  type Priority,
} from '@baytime/shared';

/** The changes a move sends to `PATCH /api/job-lines/:id`. */
export interface MovePatch {
  technicianId?: number | null;
  bayId?: number | null;
  priority?: Priority;
}

/** Where a line can be dropped or sent from its menu. */
export type MoveTarget =
  | { kind: 'queue' }
  | { kind: 'technician'; technicianId: number }
  | { kind: 'bay'; bayId: number | null }
  | { kind: 'priority'; priority: Priority };

const PRIORITY_RANK: Record<Priority, number> = { urgent: 0, high: 1, normal: 2, low: 3 };

/** Lines someone is clocked on first, then priority, promised time (none last) and time queued. */
export function byUrgency(a: DispatchLine, b: DispatchLine): number {
  return (
    b.clockedOn.length - a.clockedOn.length ||
    PRIORITY_RANK[a.priority] - PRIORITY_RANK[b.priority] ||
    (a.promisedAt ?? '9').localeCompare(b.promisedAt ?? '9') ||
    a.queuedAt.localeCompare(b.queuedAt) ||
    a.id - b.id
  );
}

/** The waiting queue: most urgent first, then the earliest promise, then the longest wait. */
export function sortQueue(lines: readonly DispatchLine[]): DispatchLine[] {
  return [...lines].sort(byUrgency);
}

export function findLine(board: DispatchBoard, lineId: number): DispatchLine | undefined {
  return (
    board.queue.find((line) => line.id === lineId) ??
    board.lanes.flatMap((lane) => lane.lines).find((line) => line.id === lineId)
  );
}

export function findLane(board: DispatchBoard, technicianId: number | null): DispatchLane | undefined {
  return technicianId === null ? undefined : board.lanes.find((lane) => lane.technician.id === technicianId);
}

export function firstName(name: string): string {
  return name.trim().split(/\s+/)[0] ?? name;
}

/** "Needs level 4; Sam is level 1" when the line asks more skill than the technician has. */
export function skillWarning(line: Pick<DispatchLine, 'skillLevel'>, lane: DispatchLane): string | null {
  const level = lane.technician.skillLevel;
  return line.skillLevel > level
    ? `Needs level ${line.skillLevel}; ${firstName(lane.technician.name)} is level ${level}`
    : null;
}

/** The patch a target stands for, or null when it would change nothing. */
export function patchFor(line: DispatchLine, target: MoveTarget): MovePatch | null {
  switch (target.kind) {
    case 'queue':
      return line.technicianId === null ? null : { technicianId: null };
    case 'technician':
      return line.technicianId === target.technicianId ? null : { technicianId: target.technicianId };
    case 'bay':
      return line.bayId === target.bayId ? null : { bayId: target.bayId };
    case 'priority':
      return line.priority === target.priority ? null : { priority: target.priority };
  }
}

export interface MovePlan {
  line: DispatchLine;
  patch: MovePatch;
  /** First names of the technicians the server will clock off: ask before moving. */
  clocksOff: string[];
  /** Not a reason to refuse: the foreman decides. */
  skillWarning: string | null;
  /** The bay holds another repair order's vehicle until it leaves: the server refuses the move. */
  bayTaken: string | null;
  /** Plain words for what the move does, for the notice and screen readers. */
  summary: string;
}

function technicianNames(board: DispatchBoard, ids: readonly number[]): string[] {
  return ids.map((id) => {
    const lane = findLane(board, id);
    return lane ? firstName(lane.technician.name) : `technician ${id}`;
  });
}

/** What moving a line to a target means: the patch, and what to ask or warn about first. */
export function planMove(board: DispatchBoard, lineId: number, target: MoveTarget): MovePlan | null {
  const line = findLine(board, lineId);
  if (!line) return null;
  const patch = patchFor(line, target);
  if (!patch) return null;
  const label = `${repairOrderLineWords(line.repairOrderNumber, line.lineNo)}: ${line.title}`;

  let summary: string;
  let warning: string | null = null;
  let clocksOff: string[] = [];
  let bayTaken: string | null = null;

  if (patch.technicianId !== undefined) {
    // The server clocks off whoever is on a line that changes hands.
    clocksOff = technicianNames(board, line.clockedOn);
    const lane = findLane(board, patch.technicianId);
    if (lane) {
      warning = skillWarning(line, lane);
      summary = `${label} moved to ${lane.technician.name}`;
    } else summary = `${label} moved back to the waiting queue`;
  } else if (patch.bayId !== undefined) {
    const bay = board.bays.find((b) => b.id === patch.bayId);
    if (bay) {
      const sameRepairOrder = [...board.queue, ...board.lanes.flatMap((l) => l.lines)].some(
        (other) => other.bayId === bay.id && other.repairOrderId === line.repairOrderId,
      );
      if (bay.state !== 'free' && !sameRepairOrder) bayTaken = bay.name;
      summary = `${label} set to ${bay.name}`;
    } else summary = `${label} no longer tied to a bay`;
  } else {
    summary = `${label} set to ${inSentence(PRIORITY_WORDS[patch.priority ?? line.priority])} priority`;
  }
  return { line, patch, clocksOff, skillWarning: warning, bayTaken, summary };
}

/** The board as it will be once the server has made the move: for an optimistic update. */
export function applyMove(board: DispatchBoard, lineId: number, patch: MovePatch): DispatchBoard {
  const line = findLine(board, lineId);
  if (!line) return board;
  const changesHands = patch.technicianId !== undefined && patch.technicianId !== line.technicianId;
  const moved: DispatchLine = {
    ...line,
    ...patch,
    clockedOn: changesHands ? [] : line.clockedOn,
    // The forecast depends on the new queue: the server works it out again.
    forecast: changesHands || patch.priority ? null : line.forecast,
  };
  const without = (lines: readonly DispatchLine[]) => lines.filter((l) => l.id !== lineId);
  const queue = without(board.queue);
  // A line of a technician with no lane (no longer active) stays in the queue until it is reassigned.
  if (!findLane(board, moved.technicianId)) queue.push(moved);
  return {
    ...board,
    queue: sortQueue(queue),
    lanes: board.lanes.map((lane) => {
      const lines = without(lane.lines);
      if (lane.technician.id === moved.technicianId) lines.push(moved);
      return lines.length === lane.lines.length && !lines.includes(moved)
        ? lane
        : { ...lane, lines: lines.sort(byUrgency) };
    }),
  };
}

/** Drop-target ids for the drag and drop layer. */
export const dropId = {
  queue: 'queue',
  lane: (technicianId: number) => `lane:${technicianId}`,
  bay: (bayId: number) => `bay:${bayId}`,
};

export function targetFromDropId(id: string | number | null | undefined): MoveTarget | null {
  if (id === dropId.queue) return { kind: 'queue' };
  const match = typeof id === 'string' ? /^(lane|bay):(\d+)$/.exec(id) : null;
  if (!match) return null;
  const value = Number(match[2]);
  return match[1] === 'lane' ? { kind: 'technician', technicianId: value } : { kind: 'bay', bayId: value };
}

export interface LaneLoad {
  lines: number;
  /** Book hours of every line in the lane. */
  bookHours: number;
}

export function laneLoad(lane: DispatchLane): LaneLoad {
  return {
    lines: lane.lines.length,
    bookHours: lane.lines.reduce((sum, line) => sum + line.bookHours, 0),
  };
}

export function joinNames(names: readonly string[]): string {
  return names.length < 2 ? (names[0] ?? '') : `${names.slice(0, -1).join(', ')} and ${names.at(-1)}`;
}

/** The question asked before a move that clocks someone off. */
export function confirmQuestion(plan: MovePlan): { title: string; text: string; action: string } {
  const names = joinNames(plan.clocksOff);
  const verb = plan.clocksOff.length > 1 ? 'are' : 'is';
  return {
    title: 'Move a line someone is working on?',
    text: `${names} ${verb} clocked on this line. Move it and clock ${names} off?`,
    action: `Move and clock ${names} off`,
  };
}

/** Moves that clock someone off are asked about first. */
export function needsConfirm(plan: MovePlan): boolean {
  return plan.clocksOff.length > 0;
}

/** Why the move cannot be made, in the words the server would answer; null when it can. */
export function moveRefusal(plan: MovePlan): string | null {
  return plan.bayTaken
    ? `${plan.bayTaken} holds another repair order's vehicle until it leaves: pick another bay, or release ${plan.bayTaken} first`
    : null;
}

/** A line in the shop's words: "Line 2 of RO 4645, Brake pads". */
export function lineWords(line: Pick<DispatchLine, 'lineNo' | 'repairOrderNumber' | 'title'>): string {
  return `Line ${line.lineNo} of RO ${line.repairOrderNumber}, ${line.title}`;
}

/** Where a drop would put the line: "the waiting queue", "Dana Ortega", "Bay 3". */
export function targetWords(board: DispatchBoard, target: MoveTarget): string {
  switch (target.kind) {
    case 'queue':
      return 'the waiting queue';
    case 'technician':
      return findLane(board, target.technicianId)?.technician.name ?? 'a technician';
    case 'bay':
      return board.bays.find((bay) => bay.id === target.bayId)?.name ?? 'a bay';
    case 'priority':
      return `${target.priority} priority`;
  }
}

interface DragArgs {
  active: { id: string | number; data: { current?: unknown } };
  over?: { id: string | number } | null;
}

/**
 * What a screen reader hears while a line is dragged, in the shop's words rather than the drag
 * layer's ids (dnd-kit's `accessibility.announcements`).
 */
export function dragAnnouncements(board: DispatchBoard) {
  const line = ({ active }: DragArgs) => {
    const lineId = (active.data.current as { lineId?: number } | undefined)?.lineId;
    const found = lineId === undefined ? undefined : findLine(board, lineId);
    return found ? lineWords(found) : 'The line';
  };
  const over = ({ over }: DragArgs) => {
    const target = targetFromDropId(over?.id);
    return target ? targetWords(board, target) : null;
  };
  return {
    onDragStart: (args: DragArgs) => `Picked up ${line(args)}.`,
    onDragOver: (args: DragArgs) => {
      const where = over(args);
      return where ? `${line(args)}, over ${where}.` : `${line(args)}, over no place to drop it.`;
    },
    onDragEnd: (args: DragArgs) => {
      const where = over(args);
      return where ? `${line(args)} dropped on ${where}.` : `${line(args)} put back where it was.`;
    },
    onDragCancel: (args: DragArgs) => `Moving ${line(args)} cancelled: it stays where it was.`,
  };
}
