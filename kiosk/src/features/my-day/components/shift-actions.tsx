import { useEffect, useState } from 'react';
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
  /** Timers running on this technician's lines: a meal break asks about them first. */
  runningTimers?: readonly RunningTimer[];
  onStopTimers?: (timerIds: number[]) => void;
}

const CONFIRM_MS = 4000;

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

/** Shift and break buttons, only those that make sense now. */
export function ShiftActions({ view, onPunch, runningTimers = [], onStopTimers }: ShiftActionsProps) {
  const [confirmingEnd, setConfirmingEnd] = useState(false);
  const [askingAboutTimers, setAskingAboutTimers] = useState(false);
  const { status, breakKind } = view.shift;

  useEffect(() => {
    if (!confirmingEnd) return;
    const timer = setTimeout(() => setConfirmingEnd(false), CONFIRM_MS);
    return () => clearTimeout(timer);
  }, [confirmingEnd]);

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

  const endShift = () => {
    if (!confirmingEnd) return setConfirmingEnd(true);
    setConfirmingEnd(false);
    onPunch([...clockOffAll(view.lines), { kind: 'shift-out', label: PUNCH_WORDS['shift-out'] }]);
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

  if (status === 'on-break') {
    const kind = breakKind ?? 'meal';
    return (
      <div className="bt-shift-actions">
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

  const startBreak = (kind: BreakKind) =>
    onPunch([
      ...clockOffAll(view.lines),
      { kind: 'break-start', breakKind: kind, label: punchWords({ kind: 'break-start', breakKind: kind }) },
    ]);

  // A timer left running through a meal is an engine or a cure nobody watches: ask first.
  const mealBreak = () => (runningTimers.length > 0 ? setAskingAboutTimers(true) : startBreak('meal'));
  const mealWith = (stop: boolean) => {
    setAskingAboutTimers(false);
    if (stop) onStopTimers?.(runningTimers.map((timer) => timer.id));
    startBreak('meal');
  };

  return (
    <div className="bt-shift-actions">
      {askingAboutTimers && (
        <Sheet title="A timer is still running" onClose={() => setAskingAboutTimers(false)}>
          <p className="bt-sheet__lead">
            {runningTimers.map((timer) => timer.words).join('; ')}. Nobody watches it during your meal break.
          </p>
          <ul className="bt-choices">
            <li>
              <button type="button" className="bt-choice bt-choice--tall" onClick={() => mealWith(true)}>
                <MealIcon />
                <span className="bt-choice__words">
                  <strong>Stop the timer, then break</strong>
                  <small>Start it again when you are back</small>
                </span>
              </button>
            </li>
            <li>
              <button type="button" className="bt-choice bt-choice--tall" onClick={() => mealWith(false)}>
                <MealIcon />
                <span className="bt-choice__words">
                  <strong>Leave it running</strong>
                  <small>Someone else keeps an eye on it</small>
                </span>
              </button>
            </li>
          </ul>
        </Sheet>
      )}
      <button type="button" className="bt-action bt-action--quiet" onClick={mealBreak}>
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
