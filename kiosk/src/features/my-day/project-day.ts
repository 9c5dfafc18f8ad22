import type { BreakKind, MyDay, MyJobLine, PunchKind, ShopSettings } from '@baytime/shared';

export type ConcurrentSplit = ShopSettings['concurrentSplit'];

/** A punch tapped on this tablet that my-day does not show yet. */
export interface PendingPunch {
  kind: PunchKind;
  jobLineId?: number;
  at: string;
  breakKind?: BreakKind;
}

export interface DayLine extends MyJobLine {
  /** Local ms since when this tech's clock has been running on the line; null when clocked off. */
  runningSince: number | null;
  /** A punch on this line is still on its way to the server. */
  pending: boolean;
}

export interface DayView {
  shift: MyDay['shift'];
  /** When the current shift began, kept through breaks; null off shift. */
  shiftStartedAt: string | null;
  lines: DayLine[];
  /** A shift or break punch is still on its way. */
  shiftPending: boolean;
  answeredFindings: MyDay['answeredFindings'];
}

/**
 * What the technician should see: the server's day with the punches still on their way laid on
 * top. Each punch applies only when it makes sense in the state reached so far, so a punch the
 * server already counted is harmless when laid on again.
 */
export function projectDay(
  day: MyDay,
  punches: readonly PendingPunch[],
  receivedAt: number,
  split: ConcurrentSplit = 'even',
): DayView {
  let shift = { ...day.shift };
  let shiftStartedAt = day.shift.status === 'on-shift' ? day.shift.since : null;
  let shiftPending = false;
  const lines: DayLine[] = day.lines.map((line) => ({
    ...line,
    runningSince: line.clockedOn ? receivedAt : null,
    pending: false,
  }));

  const stopLine = (line: DayLine, atMs: number) => {
    if (line.runningSince !== null) {
      const running = lines.filter((l) => l.runningSince !== null).length;
      const share = split === 'even' ? 1 / Math.max(1, running) : 1;
      const seconds = (Math.max(0, atMs - line.runningSince) / 1000) * share;
      line.mySeconds += seconds;
      line.allSeconds += seconds;
    }
    line.runningSince = null;
    line.clockedOn = false;
  };
  const stopAll = (atMs: number) => {
    for (const line of lines) if (line.clockedOn) stopLine(line, atMs);
  };

  const ordered = [...punches].sort((a, b) => Date.parse(a.at) - Date.parse(b.at));
  for (const punch of ordered) {
    const atMs = Date.parse(punch.at);
    const line = punch.jobLineId === undefined ? undefined : lines.find((l) => l.id === punch.jobLineId);
    switch (punch.kind) {
      case 'shift-in':
        if (shift.status === 'off') {
          shift = { status: 'on-shift', since: punch.at, breakKind: null };
          shiftStartedAt = punch.at;
          shiftPending = true;
        }
        break;
      case 'shift-out':
        if (shift.status !== 'off') {
          stopAll(atMs);
          shift = { status: 'off', since: punch.at, breakKind: null };
          shiftStartedAt = null;
          shiftPending = true;
        }
        break;
      case 'break-start':
        if (shift.status === 'on-shift') {
          stopAll(atMs);
          shift = { status: 'on-break', since: punch.at, breakKind: punch.breakKind ?? 'meal' };
          shiftPending = true;
        }
        break;
      case 'break-end':
        if (shift.status === 'on-break') {
          shift = { status: 'on-shift', since: shiftStartedAt ?? punch.at, breakKind: null };
          shiftPending = true;
        }
        break;
      case 'job-on':
        if (line && !line.clockedOn) {
          line.clockedOn = true;
          line.runningSince = atMs;
          if (line.status === 'queued') line.status = 'working';
          line.pending = true;
        }
        break;
      case 'job-off':
        if (line?.clockedOn) {
          stopLine(line, atMs);
          line.pending = true;
        }
        break;
    }
  }
  return { shift, shiftStartedAt, lines, shiftPending, answeredFindings: day.answeredFindings };
}

/** Seconds on a line at `now`: the server's count plus the running part, split as the shop splits. */
export function lineSeconds(view: DayView, line: DayLine, now: number, split: ConcurrentSplit = 'even') {
  if (line.runningSince === null) return { mine: line.mySeconds, all: line.allSeconds };
  const running = view.lines.filter((l) => l.runningSince !== null).length;
  const share = split === 'even' ? 1 / Math.max(1, running) : 1;
  const extra = (Math.max(0, now - line.runningSince) / 1000) * share;
  return { mine: line.mySeconds + extra, all: line.allSeconds + extra };
}
