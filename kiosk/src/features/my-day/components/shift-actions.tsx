import { useState, type ReactNode } from 'react';
import {
  PUNCH_WORDS,
  inSentence,
  punchWords,
  repairOrderLineWords,
  type BreakKind,
  type PunchKind,
} from '@baytime/shared';
import { CupIcon, DoorInIcon, DoorOutIcon, MealIcon, PlayIcon } from '@/components/icons';
import { Sheet } from '@/components/sheet';
import { useTapConfirm } from '@/hooks/use-tap-confirm';
import type { DayLine, DayView } from '../project-day';

export interface ShiftPunch {
  kind: PunchKind;
  jobLineId?: number;
  breakKind?: BreakKind;
  label: string;
}

/** A timer still running on one of this technician's lines, in words for the question. */
export interface RunningTimer {
  id: number;
  words: string;
}

export interface ShiftActionsProps {
  view: DayView;
  onPunch: (punches: ShiftPunch[]) => void;
  /** Timers still counting on this technician's lines: a meal break and the shift's end ask about them first. */
  runningTimers?: readonly RunningTimer[];
  onStopTimers?: (timerIds: number[]) => void;
}

/** Clocks off every running line first: job time stops when the shift or a break starts. */
export function clockOffAll(lines: readonly DayLine[]): ShiftPunch[] {
  return lines
    .filter((line) => line.clockedOn)
    .map((line) => ({
      kind: 'job-off',
      jobLineId: line.id,
      label: `${PUNCH_WORDS['job-off']} ${repairOrderLineWords(line.repairOrderNumber, line.lineNo)}`,
    }));
}

/** What the technician is about to leave the timers for, in the question's words. */
type Leaving = 'meal' | 'shift-out';
const LEAVING: Record<Leaving, { during: string; stop: string; again: string; icon: ReactNode }> = {
  meal: {
    during: 'during your meal break',
    stop: 'Stop the timer, then break',
    again: 'Start it again when you are back',
    icon: <MealIcon />,
  },
  'shift-out': {
    during: 'after your shift ends',
    stop: 'Stop the timer, then end the shift',
    again: 'Whoever works the line next starts it again',
    icon: <DoorOutIcon />,
  },
};

/** Shift and break buttons, only those that make sense now. */
export function ShiftActions({ view, onPunch, runningTimers = [], onStopTimers }: ShiftActionsProps) {
  const confirmEnd = useTapConfirm();
  const confirmingEnd = confirmEnd.armed;
  // The timers as they were when asked: one that finishes meanwhile is still named, and stopped if asked.
  const [asking, setAsking] = useState<{ leaving: Leaving; timers: readonly RunningTimer[] } | null>(null);
  const { status, breakKind } = view.shift;

  if (status === 'off') {
    return (
      <div className="bt-shift-actions">
        <button
          type="button"
          className="bt-action bt-action--go"
          onClick={() => onPunch([{ kind: 'shift-in', label: PUNCH_WORDS['shift-in'] }])}
        >
          <DoorInIcon /> {PUNCH_WORDS['shift-in']}
        </button>
      </div>
    );
  }

  const startBreak = (kind: BreakKind) =>
    onPunch([
      ...clockOffAll(view.lines),
      { kind: 'break-start', breakKind: kind, label: punchWords({ kind: 'break-start', breakKind: kind }) },
    ]);
  const leave = (leaving: Leaving) =>
    leaving === 'meal'
      ? startBreak('meal')
      : onPunch([...clockOffAll(view.lines), { kind: 'shift-out', label: PUNCH_WORDS['shift-out'] }]);
  // A timer left counting through a meal or past the shift's end is an engine or a cure nobody
  // watches: ask first.
  const askFirst = (leaving: Leaving) =>
    runningTimers.length > 0 ? setAsking({ leaving, timers: runningTimers }) : leave(leaving);
  const leaveWith = (stop: boolean) => {
    if (!asking) return;
    setAsking(null);
    if (stop) onStopTimers?.(asking.timers.map((timer) => timer.id));
    leave(asking.leaving);
  };

  const endShift = () => {
    // The question about the timers is the confirmation: no second tap before it.
    if (runningTimers.length > 0) return askFirst('shift-out');
    if (confirmEnd.tap()) leave('shift-out');
  };
  const endShiftButton = (
    <button
      type="button"
      className={`bt-action ${confirmingEnd ? 'bt-action--confirm' : 'bt-action--quiet'}`}
      onClick={endShift}
      aria-live="polite"
    >
      <DoorOutIcon />{' '}
      {confirmingEnd ? `Tap again: ${inSentence(PUNCH_WORDS['shift-out'])}` : PUNCH_WORDS['shift-out']}
    </button>
  );
  const timerQuestion = asking && (
    <Sheet title="A timer is still running" onClose={() => setAsking(null)}>
      <p className="bt-sheet__lead">
        {asking.timers.map((timer) => timer.words).join('; ')}. Nobody watches it{' '}
        {LEAVING[asking.leaving].during}.
      </p>
      <ul className="bt-choices">
        <li>
          <button type="button" className="bt-choice bt-choice--tall" onClick={() => leaveWith(true)}>
            {LEAVING[asking.leaving].icon}
            <span className="bt-choice__words">
              <strong>{LEAVING[asking.leaving].stop}</strong>
              <small>{LEAVING[asking.leaving].again}</small>
            </span>
          </button>
        </li>
        <li>
          <button type="button" className="bt-choice bt-choice--tall" onClick={() => leaveWith(false)}>
            {LEAVING[asking.leaving].icon}
            <span className="bt-choice__words">
              <strong>Leave it running</strong>
              <small>Someone else keeps an eye on it</small>
            </span>
          </button>
        </li>
      </ul>
    </Sheet>
  );

  if (status === 'on-break') {
    const kind = breakKind ?? 'meal';
    return (
      <div className="bt-shift-actions">
        {timerQuestion}
        <button
          type="button"
          className="bt-action bt-action--go"
          onClick={() => onPunch([{ kind: 'break-end', breakKind: kind, label: PUNCH_WORDS['break-end'] }])}
        >
          <PlayIcon /> {PUNCH_WORDS['break-end']}
        </button>
        {endShiftButton}
      </div>
    );
  }

  return (
    <div className="bt-shift-actions">
      {timerQuestion}
      <button type="button" className="bt-action bt-action--quiet" onClick={() => askFirst('meal')}>
        <MealIcon /> {punchWords({ kind: 'break-start', breakKind: 'meal' })}
      </button>
      <button type="button" className="bt-action bt-action--quiet" onClick={() => startBreak('rest')}>
        <CupIcon /> {punchWords({ kind: 'break-start', breakKind: 'rest' })}
      </button>
      {endShiftButton}
      <p className="bt-shift-actions__note">
        A meal break is unpaid; a rest break is short and paid. Either one clocks you off your lines.
      </p>
    </div>
  );
}
