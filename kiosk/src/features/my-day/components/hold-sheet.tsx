import { useState } from 'react';
import type { HoldReason } from '@baytime/shared';
import { PauseIcon } from '@/components/icons';
import { Sheet, SheetProblem } from '@/components/sheet';
import { commandProblem } from '@/lib/commands';
import { useHoldLine } from '../api/hold-line';
import { HOLD_CHOICES } from '../hold-words';
import type { DayLine } from '../project-day';

export interface HoldSheetProps {
  line: DayLine;
  context: string;
  onClose: () => void;
}

/** Why the line waits: one tap on a reason holds it. */
export function HoldSheet({ line, context, onClose }: HoldSheetProps) {
  const hold = useHoldLine();
  const [chosen, setChosen] = useState<HoldReason | null>(null);
  const send = (reason: HoldReason) => {
    setChosen(reason);
    hold.mutate({ jobLineId: line.id, reason }, { onSuccess: onClose });
  };

  return (
    <Sheet title="Put this line on hold" context={context} onClose={onClose} wide>
      <p className="bt-sheet__lead">
        Why is it waiting?{' '}
        {line.clockedOn ? 'This clocks you off the line.' : 'Anyone clocked on it is clocked off.'}
      </p>
      <ul className="bt-choices bt-choices--two">
        {HOLD_CHOICES.map((choice) => (
          <li key={choice.reason}>
            <button
              type="button"
              className={`bt-choice${chosen === choice.reason ? ' is-selected' : ''}`}
              disabled={hold.isPending}
              onClick={() => send(choice.reason)}
            >
              <PauseIcon />
              <span className="bt-choice__words">
                <strong>{choice.words}</strong>
                <small>{hold.isPending && chosen === choice.reason ? 'Sending…' : choice.hint}</small>
              </span>
            </button>
          </li>
        ))}
      </ul>
      <SheetProblem>{hold.error ? commandProblem(hold.error) : null}</SheetProblem>
    </Sheet>
  );
}
