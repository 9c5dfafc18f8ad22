import { useEffect, useState } from 'react';
import type { BreakKind, PunchKind } from '@baytime/shared';
import { CupIcon, DoorInIcon, DoorOutIcon, MealIcon, PlayIcon } from '@/components/icons';
import type { DayLine, DayView } from '../project-day';

export interface ShiftPunch {
  kind: PunchKind;
  jobLineId?: number;
  breakKind?: BreakKind;
  label: string;
}

export interface ShiftActionsProps {
  view: DayView;
  onPunch: (punches: ShiftPunch[]) => void;
}

const CONFIRM_MS = 4000;

/** Clocks off every running line first: job time stops when the shift or a break starts. */
export function clockOffAll(lines: readonly DayLine[]): ShiftPunch[] {
  return lines
    .filter((line) => line.clockedOn)
    .map((line) => ({
      kind: 'job-off',
      jobLineId: line.id,
      label: `Clock off RO ${line.repairOrderNumber} line ${line.lineNo}`,
    }));
}

/** Shift and break buttons, only those that make sense now. */
export function ShiftActions({ view, onPunch }: ShiftActionsProps) {
  const [confirmingEnd, setConfirmingEnd] = useState(false);
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
          onClick={() => onPunch([{ kind: 'shift-in', label: 'Start shift' }])}
        >
          <DoorInIcon /> Start shift
        </button>
      </div>
    );
  }

  const endShift = () => {
    if (!confirmingEnd) return setConfirmingEnd(true);
    setConfirmingEnd(false);
    onPunch([...clockOffAll(view.lines), { kind: 'shift-out', label: 'End shift' }]);
  };
  const endShiftButton = (
    <button
      type="button"
      className={`bt-action ${confirmingEnd ? 'bt-action--confirm' : 'bt-action--quiet'}`}
      onClick={endShift}
      aria-live="polite"
    >
      <DoorOutIcon /> {confirmingEnd ? 'Tap again to end shift' : 'End shift'}
    </button>
  );

  if (status === 'on-break') {
    const kind = breakKind ?? 'meal';
    return (
      <div className="bt-shift-actions">
        <button
          type="button"
          className="bt-action bt-action--go"
          onClick={() => onPunch([{ kind: 'break-end', breakKind: kind, label: `End ${kind} break` }])}
        >
          <PlayIcon /> End {kind} break
        </button>
        {endShiftButton}
      </div>
    );
  }

  const startBreak = (kind: BreakKind) =>
    onPunch([
      ...clockOffAll(view.lines),
      { kind: 'break-start', breakKind: kind, label: `Start ${kind} break` },
    ]);

  return (
    <div className="bt-shift-actions">
      <button type="button" className="bt-action bt-action--break" onClick={() => startBreak('meal')}>
        <MealIcon /> Start meal break
      </button>
      <button type="button" className="bt-action bt-action--break" onClick={() => startBreak('rest')}>
        <CupIcon /> Start rest break
      </button>
      {endShiftButton}
      <p className="bt-shift-actions__note">
        A meal break is unpaid; a rest break is short and paid. Either one clocks you off your lines.
      </p>
    </div>
  );
}
