import { useState } from 'react';
import type { FinishLineBody } from '@baytime/shared';
import { CheckIcon, FlagIcon } from '@/components/icons';
import { Sheet, SheetProblem } from '@/components/sheet';
import { commandProblem } from '@/lib/commands';
import { useFinishLine } from '../api/finish-line';
import type { DayLine } from '../project-day';

type Next = FinishLineBody['next'];

const CHOICES: readonly { next: Next; words: string; hint: string; Icon: typeof CheckIcon }[] = [
  {
    next: 'check',
    words: 'Final check next',
    hint: 'A road test or a last look before the vehicle leaves',
    Icon: FlagIcon,
  },
  {
    next: 'ready',
    words: 'Ready to go',
    hint: 'Nothing left to do: the vehicle can move out',
    Icon: CheckIcon,
  },
];

export interface DoneSheetProps {
  line: DayLine;
  context: string;
  onClose: () => void;
}

/** Marks the line done and says what the vehicle needs next. */
export function DoneSheet({ line, context, onClose }: DoneSheetProps) {
  const finish = useFinishLine();
  const [chosen, setChosen] = useState<Next | null>(null);
  const send = (next: Next) => {
    setChosen(next);
    finish.mutate({ jobLineId: line.id, next }, { onSuccess: onClose });
  };

  return (
    <Sheet title="Mark this line done" context={context} onClose={onClose}>
      <p className="bt-sheet__lead">
        {line.clockedOn ? 'This clocks you off the line. ' : ''}What does the vehicle need next?
        {line.bayName ? ` ${line.bayName} changes only when this is its last open line.` : ''}
      </p>
      <ul className="bt-choices">
        {CHOICES.map(({ next, words, hint, Icon }) => (
          <li key={next}>
            <button
              type="button"
              className={`bt-choice bt-choice--tall${chosen === next ? ' is-selected' : ''}`}
              disabled={finish.isPending}
              onClick={() => send(next)}
            >
              <Icon />
              <span className="bt-choice__words">
                <strong>{words}</strong>
                <small>{finish.isPending && chosen === next ? 'Sending…' : hint}</small>
              </span>
            </button>
          </li>
        ))}
      </ul>
      <SheetProblem>{finish.error ? commandProblem(finish.error) : null}</SheetProblem>
    </Sheet>
  );
}
