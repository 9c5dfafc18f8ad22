import { useState } from 'react';
import { punchWords, type BreakKind, type OfflinePunchKind } from '@baytime/shared';
import { Sheet, SheetProblem } from '@/components/sheet';
import { clockTime } from '@/lib/format';
import { recordOfflinePunch } from '../record-offline';

const CHOICES: readonly { kind: OfflinePunchKind; breakKind?: BreakKind; words: string }[] = (
  [
    { kind: 'shift-in' },
    { kind: 'shift-out' },
    { kind: 'break-start', breakKind: 'meal' },
    { kind: 'break-start', breakKind: 'rest' },
    { kind: 'break-end' },
  ] as const
).map((choice) => ({ ...choice, words: punchWords(choice) }));

export interface OfflinePunchSheetProps {
  badge: string;
  pin: string;
  timeZone: string | undefined;
  onDone: (message: string) => void;
  onClose: () => void;
}

/** No link to the server: a shift or break punch is kept on the tablet and checked by the server later. */
export function OfflinePunchSheet({ badge, pin, timeZone, onDone, onClose }: OfflinePunchSheetProps) {
  const [busy, setBusy] = useState(false);
  const [problem, setProblem] = useState<string | null>(null);
  const choose = (choice: (typeof CHOICES)[number]) => {
    setBusy(true);
    const label = `${choice.words} (recorded offline)`;
    recordOfflinePunch({ badge, pin, kind: choice.kind, breakKind: choice.breakKind, label }).then(
      (at) =>
        onDone(
          `${choice.words} recorded offline for badge ${badge} at ${clockTime(at, timeZone)}. It goes to the server when the link is back and counts once you next sign in online.`,
        ),
      (error: unknown) => {
        setBusy(false);
        setProblem(
          error instanceof Error ? error.message : 'This tablet could not save it. Tell the foreman.',
        );
      },
    );
  };
  return (
    <Sheet
      title="No connection: record a punch offline"
      context={`Badge ${badge}`}
      onClose={onClose}
      wide
      footer={problem && <SheetProblem>{problem}</SheetProblem>}
    >
      <p className="bt-sheet__lead">
        The shop server cannot be reached. A shift or break punch is kept on this tablet with the time you
        tap, and the server checks your PIN when the link is back. Jobs wait until then.
      </p>
      <ul className="bt-choices bt-choices--two">
        {CHOICES.map((choice) => (
          <li key={choice.words}>
            <button type="button" className="bt-choice" disabled={busy} onClick={() => choose(choice)}>
              <span className="bt-choice__words">
                <strong>{choice.words}</strong>
              </span>
            </button>
          </li>
        ))}
      </ul>
    </Sheet>
  );
}
