import { useId, useState, type ReactNode } from 'react';
import { BAY_STATE_WORDS, kioskDoneSchema, type FinishLineBody } from '@baytime/shared';
import { CheckIcon, MeaningGlyph } from '@/components/icons';
import { Sheet, SheetProblem } from '@/components/sheet';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useFinishLine } from '../api/finish-line';
import type { DayLine } from '../project-day';

type Next = FinishLineBody['next'];

const CHOICES: readonly { next: Next; words: string; hint: string; icon: ReactNode }[] = [
  {
    next: 'check',
    words: `${BAY_STATE_WORDS.check} next`,
    hint: 'A road test or a last look before the vehicle leaves',
    icon: <MeaningGlyph name="final-check-next" />,
  },
  {
    next: 'ready',
    words: 'Ready to go',
    hint: 'Nothing left to do: the vehicle can move out',
    icon: <CheckIcon />,
  },
];

export interface DoneSheetProps {
  line: DayLine;
  context: string;
  onClose: () => void;
}

/** Marks the line done with what was found and what was done, and says what the vehicle needs next. */
export function DoneSheet({ line, context, onClose }: DoneSheetProps) {
  const finish = useFinishLine();
  const [chosen, setChosen] = useState<Next | null>(null);
  const form = useSchemaForm(kioskDoneSchema, { defaultValues: { cause: '', correction: '' } });
  const { errors } = form.formState;
  const causeId = useId();
  const correctionId = useId();

  const send = (next: Next) =>
    form.handleSubmit(({ cause, correction }) => {
      setChosen(next);
      finish.mutate(
        { jobLineId: line.id, body: { next, cause, correction } },
        { onSuccess: onClose, onError: (error) => showServerErrors(form, error) },
      );
    })();

  const footer = (
    <>
      <p className="bt-sheet__lead">
        {line.clockedOn ? 'This clocks you off the line. ' : ''}What does the vehicle need next?
        {line.bayName ? ` ${line.bayName} changes only when this is its last open line.` : ''}
      </p>
      <ul className="bt-choices bt-choices--two">
        {CHOICES.map(({ next, words, hint, icon }) => (
          <li key={next}>
            <button
              type="button"
              className={`bt-choice${chosen === next ? ' is-selected' : ''}`}
              disabled={finish.isPending}
              onClick={() => void send(next)}
            >
              {icon}
              <span className="bt-choice__words">
                <strong>{words}</strong>
                <small>{finish.isPending && chosen === next ? 'Sending…' : hint}</small>
              </span>
            </button>
          </li>
        ))}
      </ul>
      <SheetProblem>{errors.root?.server?.message ?? null}</SheetProblem>
    </>
  );

  return (
    <Sheet title="Mark this line done" context={context} onClose={onClose} wide footer={footer}>
      <form className="bt-done" noValidate onSubmit={(event) => event.preventDefault()}>
        <p className="bt-done__concern">
          <strong>Concern:</strong> {line.concern}
        </p>
        <label className="bt-done__label" htmlFor={causeId}>
          Cause: what you found
        </label>
        <textarea
          id={causeId}
          className={`bt-done__field${errors.cause ? ' is-invalid' : ''}`}
          rows={3}
          aria-invalid={!!errors.cause}
          aria-describedby={errors.cause ? `${causeId}-problem` : undefined}
          {...form.register('cause')}
        />
        {errors.cause && (
          <p id={`${causeId}-problem`} className="bt-done__problem" role="alert">
            {errors.cause.message}
          </p>
        )}
        <label className="bt-done__label" htmlFor={correctionId}>
          Correction: what you did
        </label>
        <textarea
          id={correctionId}
          className={`bt-done__field${errors.correction ? ' is-invalid' : ''}`}
          rows={3}
          aria-invalid={!!errors.correction}
          aria-describedby={errors.correction ? `${correctionId}-problem` : undefined}
          {...form.register('correction')}
        />
        {errors.correction && (
          <p id={`${correctionId}-problem`} className="bt-done__problem" role="alert">
            {errors.correction.message}
          </p>
        )}
      </form>
    </Sheet>
  );
}
