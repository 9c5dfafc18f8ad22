import { useId, useState, type FormEvent } from 'react';
import { holdLineSchema, type HoldReason } from '@baytime/shared';
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

/** Why the line waits: one tap on a reason holds it; for parts the technician may first name the part. */
export function HoldSheet({ line, context, onClose }: HoldSheetProps) {
  const hold = useHoldLine();
  const [chosen, setChosen] = useState<HoldReason | null>(null);
  const [askingPart, setAskingPart] = useState(false);
  const send = (reason: HoldReason, part?: string) => {
    setChosen(reason);
    hold.mutate({ jobLineId: line.id, reason, ...(part && { part }) }, { onSuccess: onClose });
  };

  const problem = hold.error ? commandProblem(hold.error) : null;

  if (askingPart)
    return (
      <PartStep
        context={context}
        sending={hold.isPending}
        problem={problem}
        onSend={(part) => send('parts', part)}
        onClose={onClose}
        onBack={() => setAskingPart(false)}
      />
    );

  return (
    <Sheet
      title="Put this line on hold"
      context={context}
      onClose={onClose}
      wide
      footer={problem && <SheetProblem>{problem}</SheetProblem>}
    >
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
              onClick={() => (choice.reason === 'parts' ? setAskingPart(true) : send(choice.reason))}
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
    </Sheet>
  );
}

/** Which part: optional, the office records the order, the supplier and the arrival. */
function PartStep({
  context,
  sending,
  problem,
  onSend,
  onClose,
  onBack,
}: {
  context: string;
  sending: boolean;
  problem: string | null;
  onSend: (part: string | undefined) => void;
  onClose: () => void;
  onBack: () => void;
}) {
  const id = useId();
  const formId = useId();
  const [part, setPart] = useState('');
  const [invalid, setInvalid] = useState<string | null>(null);
  const submit = (event: FormEvent) => {
    event.preventDefault();
    if (part.trim() === '') return onSend(undefined);
    const check = holdLineSchema.safeParse({ reason: 'parts', part });
    if (!check.success) return setInvalid(check.error.issues[0]?.message ?? 'Check the part');
    onSend(check.data.part);
  };
  return (
    <Sheet
      title="Waiting for parts"
      context={context}
      onClose={onClose}
      closeLabel="Back"
      onBack={onBack}
      wide
      footer={
        <>
          <button type="submit" form={formId} className="bt-action bt-action--go" disabled={sending}>
            <PauseIcon /> {sending ? 'Sending…' : 'Hold for parts'}
          </button>
          <SheetProblem>{invalid ?? problem}</SheetProblem>
        </>
      }
    >
      <form id={formId} className="bt-hold-part" onSubmit={submit} noValidate>
        <label className="bt-hold-part__label" htmlFor={id}>
          Which part is needed? <small>(optional: the office orders it)</small>
        </label>
        <input
          id={id}
          className={`bt-hold-part__input${invalid ? ' is-invalid' : ''}`}
          autoComplete="off"
          maxLength={120}
          placeholder="e.g. left outer tie rod end"
          value={part}
          disabled={sending}
          aria-invalid={invalid !== null}
          onChange={(event) => {
            setPart(event.target.value);
            setInvalid(null);
          }}
        />
      </form>
    </Sheet>
  );
}
