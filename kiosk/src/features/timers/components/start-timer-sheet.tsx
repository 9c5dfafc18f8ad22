import { useState, type ReactNode } from 'react';
import {
  TIMER_KIND_LABELS,
  temperatureUnit,
  type HoldPresetDto,
  type TimerKind,
  type UnitSystem,
} from '@baytime/shared';
import { AlertIcon, HourglassIcon, SnowIcon, ThermometerIcon } from '@/components/icons';
import { Sheet } from '@/components/sheet';
import { commandProblem } from '@/lib/commands';
import { durationWords } from '@/lib/format';
import {
  MINUTES_ENTRY,
  TEMPERATURE_ENTRY,
  checkTimerTemperatures,
  editEntry,
  readMinutes,
  readTemperature,
  type EntryKey,
} from '../temperature-entry';
import { TIMER_CAUTIONS } from '../timer-cautions';
import { useHoldPresets } from '../api/get-hold-presets';
import { useStartTimer } from '../api/start-timer';
import { EntryKeypad, EntrySend, NumberField } from './number-field';
import './timers.css';

type TemperatureKind = Exclude<TimerKind, 'set-time'>;
type Step =
  | { name: 'kind' }
  | { name: 'caution'; kind: TemperatureKind }
  | { name: 'temperatures'; kind: TemperatureKind }
  | { name: 'set-time' };

export interface StartTimerSheetProps {
  jobLineId: number;
  context: string;
  units: UnitSystem;
  onClose: () => void;
}

/** Start a timer on a line: pick the kind, confirm the safety checks, enter the numbers. */
export function StartTimerSheet({ jobLineId, context, units, onClose }: StartTimerSheetProps) {
  const [step, setStep] = useState<Step>({ name: 'kind' });
  const back = () =>
    setStep(step.name === 'temperatures' ? { name: 'caution', kind: step.kind } : { name: 'kind' });

  if (step.name === 'kind')
    return (
      <Sheet title="Start a timer" context={context} onClose={onClose}>
        <ul className="bt-choices">
          <li>
            <button
              type="button"
              className="bt-choice"
              onClick={() => setStep({ name: 'caution', kind: 'warm-up' })}
            >
              <ThermometerIcon />
              <span className="bt-choice__words">
                <strong>Warm-up to a temperature</strong>
                <small>Engine running until a fluid reaches the temperature you set</small>
              </span>
            </button>
          </li>
          <li>
            <button
              type="button"
              className="bt-choice"
              onClick={() => setStep({ name: 'caution', kind: 'cool-down' })}
            >
              <SnowIcon />
              <span className="bt-choice__words">
                <strong>Cool-down to a temperature</strong>
                <small>Wait until a part or fluid has cooled to the temperature you set</small>
              </span>
            </button>
          </li>
          <li>
            <button type="button" className="bt-choice" onClick={() => setStep({ name: 'set-time' })}>
              <HourglassIcon />
              <span className="bt-choice__words">
                <strong>{TIMER_KIND_LABELS['set-time']}</strong>
                <small>A fixed number of minutes: sealant cure, vacuum test, soak</small>
              </span>
            </button>
          </li>
        </ul>
      </Sheet>
    );

  if (step.name === 'caution') {
    const caution = TIMER_CAUTIONS[step.kind];
    return (
      <Sheet
        title={`${TIMER_KIND_LABELS[step.kind]}: safety first`}
        context={context}
        onClose={onClose}
        onBack={back}
        footer={
          <button
            type="button"
            className="bt-action bt-action--go bt-entry__go"
            onClick={() => setStep({ name: 'temperatures', kind: step.kind })}
          >
            All checked: go on
          </button>
        }
      >
        <div className="bt-caution">
          <div className="bt-caution__box" role="note">
            <p className="bt-caution__title">
              <AlertIcon /> {caution.heading}
            </p>
            <ul className="bt-caution__list">
              {caution.checks.map((check) => (
                <li key={check}>{check}</li>
              ))}
            </ul>
          </div>
          <p className="bt-caution__spec">{caution.source}</p>
        </div>
      </Sheet>
    );
  }

  const frame = { context, onClose, onBack: back, jobLineId, onStarted: onClose };
  if (step.name === 'temperatures') return <TemperatureStep frame={frame} kind={step.kind} units={units} />;
  return <SetTimeStep frame={frame} />;
}

/** What each entry step gets: where its sheet sits and what it starts the timer on. */
interface StepFrame {
  context: string;
  onClose: () => void;
  onBack: () => void;
  jobLineId: number;
  onStarted: () => void;
}

/** An entry step's sheet: what went wrong and the start button stay in view below the entry. */
function StartStepSheet({
  frame,
  title,
  problem,
  start,
  onSend,
  label,
  children,
}: {
  frame: StepFrame;
  title: string;
  problem: string | null;
  start: ReturnType<typeof useStartTimer>;
  onSend: () => void;
  label: string;
  children: ReactNode;
}) {
  return (
    <Sheet
      title={title}
      context={frame.context}
      onClose={frame.onClose}
      onBack={frame.onBack}
      wide
      footer={
        <EntrySend
          problem={problem ?? (start.error ? commandProblem(start.error) : '')}
          busy={start.isPending}
          onSend={onSend}
        >
          {start.isPending ? 'Starting…' : label}
        </EntrySend>
      }
    >
      {children}
    </Sheet>
  );
}

function TemperatureStep({
  frame,
  kind,
  units,
}: {
  frame: StepFrame;
  kind: TemperatureKind;
  units: UnitSystem;
}) {
  const { jobLineId, onStarted } = frame;
  const [active, setActive] = useState<'target' | 'ambient'>('target');
  const [target, setTarget] = useState('');
  const [ambient, setAmbient] = useState('');
  const [problem, setProblem] = useState<{ field: 'target' | 'ambient' | null; message: string } | null>(
    null,
  );
  const start = useStartTimer();
  const unit = temperatureUnit(units);

  const apply = (key: EntryKey) => {
    setProblem(null);
    start.reset();
    (active === 'target' ? setTarget : setAmbient)((text) => editEntry(text, key, TEMPERATURE_ENTRY));
  };

  const submit = () => {
    const targetRead = readTemperature(target, units, 'the target temperature');
    if (!targetRead.ok) {
      setActive('target');
      return setProblem({ field: 'target', message: targetRead.message });
    }
    let ambientC: number | null = null;
    if (ambient !== '') {
      const ambientRead = readTemperature(ambient, units);
      if (!ambientRead.ok) {
        setActive('ambient');
        return setProblem({ field: 'ambient', message: ambientRead.message });
      }
      ambientC = ambientRead.value;
    }
    const mismatch = checkTimerTemperatures(kind, targetRead.value, ambientC);
    if (mismatch) return setProblem({ field: 'ambient', message: mismatch });
    start.mutate(
      {
        jobLineId,
        kind,
        targetC: targetRead.value,
        ...(ambientC !== null && { ambientC }),
        cautionAcknowledged: true,
      },
      { onSuccess: onStarted },
    );
  };
  return (
    <StartStepSheet
      frame={frame}
      title={`${TIMER_KIND_LABELS[kind]} to a temperature`}
      problem={problem?.message ?? null}
      start={start}
      onSend={submit}
      label={`Start ${kind}`}
    >
      <div className="bt-entry">
        <div className="bt-entry__fields">
          <NumberField
            label={`Target (${unit}), from the maker’s procedure`}
            text={target}
            unit={unit}
            active={active === 'target'}
            invalid={problem?.field === 'target'}
            onSelect={() => setActive('target')}
          />
          <NumberField
            label={kind === 'warm-up' ? 'Where it levels off (optional)' : 'Room temperature (optional)'}
            hint={
              kind === 'warm-up'
                ? 'If you know where it settles with the engine running. Leave empty and Baytime works it out from your readings.'
                : 'If you know the shop’s air temperature. Leave empty and Baytime works it out from your readings.'
            }
            text={ambient}
            unit={unit}
            active={active === 'ambient'}
            invalid={problem?.field === 'ambient'}
            placeholder="Tap here to enter"
            onSelect={() => setActive('ambient')}
          />
        </div>
        <EntryKeypad apply={apply} rules={TEMPERATURE_ENTRY} onEnter={submit} disabled={start.isPending} />
      </div>
    </StartStepSheet>
  );
}

function SetTimeStep({ frame }: { frame: StepFrame }) {
  const { jobLineId, onStarted } = frame;
  const presets = useHoldPresets();
  const [preset, setPreset] = useState<HoldPresetDto | null>(null);
  const [minutes, setMinutes] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  const start = useStartTimer();

  const apply = (key: EntryKey) => {
    setProblem(null);
    start.reset();
    setPreset(null);
    setMinutes((text) => editEntry(text, key, MINUTES_ENTRY));
  };

  const submit = () => {
    let durationSeconds: number;
    let label: string | undefined;
    if (preset) {
      durationSeconds = preset.durationSeconds;
      label = preset.name;
    } else {
      const read = readMinutes(minutes);
      if (!read.ok)
        return setProblem(
          presets.data?.length
            ? `Pick one of the shop’s times, or ${lowerFirst(read.message)}`
            : read.message,
        );
      durationSeconds = read.value;
    }
    start.mutate(
      { jobLineId, kind: 'set-time', durationSeconds, ...(label && { label }) },
      { onSuccess: onStarted },
    );
  };
  const list = presets.data ?? [];
  const caution = TIMER_CAUTIONS['set-time'];
  return (
    <StartStepSheet
      frame={frame}
      title={TIMER_KIND_LABELS['set-time']}
      problem={problem}
      start={start}
      onSend={submit}
      label={preset ? `Start ${preset.name} · ${durationWords(preset.durationSeconds)}` : 'Start the timer'}
    >
      <div className="bt-entry">
        <div className="bt-entry__fields">
          <p className="bt-caution__spec" role="note">
            {caution.heading} {caution.source}
          </p>
          {list.length > 0 && (
            <>
              <p className="bt-entry__section-title">The shop’s set times</p>
              <ul className="bt-presets">
                {list.map((p) => (
                  <li key={p.id}>
                    <button
                      type="button"
                      className={`bt-choice${preset?.id === p.id ? ' is-selected' : ''}`}
                      onClick={() => {
                        setPreset(p);
                        setMinutes('');
                        setProblem(null);
                      }}
                      aria-pressed={preset?.id === p.id}
                    >
                      <span className="bt-choice__words">
                        <strong>{p.name}</strong>
                        <small>{durationWords(p.durationSeconds)}</small>
                      </span>
                    </button>
                  </li>
                ))}
              </ul>
              <p className="bt-entry__section-title">Or your own time</p>
            </>
          )}
          {presets.isError && (
            <p className="bt-entry__facts">The shop’s set times could not be loaded: type the minutes.</p>
          )}
          <NumberField
            label="Minutes"
            text={minutes}
            unit="min"
            active={preset === null}
            invalid={problem !== null}
            placeholder={list.length > 0 ? 'Or type minutes' : 'Type minutes'}
            onSelect={() => setPreset(null)}
          />
        </div>
        <EntryKeypad apply={apply} rules={MINUTES_ENTRY} onEnter={submit} disabled={start.isPending} />
      </div>
    </StartStepSheet>
  );
}

const lowerFirst = (text: string) => text.charAt(0).toLowerCase() + text.slice(1);
