import type { TimerDto, UnitSystem } from '@baytime/shared';
import { CheckIcon, HourglassIcon, SnowIcon, StopIcon, ThermometerIcon } from '@/components/icons';
import { useNow } from '@/hooks/use-now';
import { useTapConfirm } from '@/hooks/use-tap-confirm';
import { commandProblem } from '@/lib/commands';
import { describeTimer } from '../timer-status';
import { useStopTimer } from '../api/stop-timer';
import './timers.css';

export interface TimerPanelProps {
  timer: TimerDto;
  /** When the timer list was fetched: the countdown runs from the server's answer. */
  fetchedAt: number;
  units: UnitSystem;
  timeZone?: string;
  onLogReading: () => void;
}

const KIND_ICONS = { 'warm-up': ThermometerIcon, 'cool-down': SnowIcon, 'set-time': HourglassIcon } as const;

/** A running timer on its line card: what it waits for, how long still, and a big Log reading. */
export function TimerPanel({ timer, fetchedAt, units, timeZone, onLogReading }: TimerPanelProps) {
  const now = useNow(1000);
  const stop = useStopTimer();
  const confirmStop = useTapConfirm();
  const confirming = confirmStop.armed;
  const view = describeTimer(timer, { now, fetchedAt, units, timeZone });
  const Icon = view.finished ? CheckIcon : KIND_ICONS[timer.kind];

  const onStop = () => {
    // A finished timer stops at one tap; a running one asks once more.
    if (view.finished) confirmStop.reset();
    else if (!confirmStop.tap()) return;
    stop.mutate(timer.id);
  };

  return (
    <section className={`bt-timer bt-timer--${view.tone}`} aria-label={`Timer: ${view.headline}`}>
      <span className="bt-timer__icon" aria-hidden="true">
        <Icon />
      </span>
      <div className="bt-timer__words">
        <p className="bt-timer__headline">{view.headline}</p>
        <p className="bt-timer__state">{view.state}</p>
        {(view.detail || view.confidence) && (
          <p className="bt-timer__detail">
            {view.detail}
            {view.confidence && (
              <span className="bt-timer__confidence">
                {view.detail ? ' · ' : ''}
                {view.confidence}
              </span>
            )}
          </p>
        )}
        {view.lastReading && <p className="bt-timer__reading">{view.lastReading}</p>}
        {view.progress !== null && (
          <div
            className="bt-timer__progress"
            role="progressbar"
            aria-label="Progress"
            aria-valuemin={0}
            aria-valuemax={100}
            aria-valuenow={Math.round(view.progress * 100)}
          >
            <span style={{ width: `${view.progress * 100}%` }} />
          </div>
        )}
      </div>
      <div className="bt-timer__buttons">
        {view.takesReadings && (
          <button type="button" className="bt-action bt-action--go" onClick={onLogReading}>
            <ThermometerIcon /> Log reading
          </button>
        )}
        <button
          type="button"
          className={`bt-action ${confirming ? 'bt-action--confirm' : view.finished ? 'bt-action--go' : 'bt-action--quiet'}`}
          onClick={onStop}
          disabled={stop.isPending}
        >
          <StopIcon />
          {stop.isPending
            ? 'Stopping…'
            : confirming
              ? 'Tap again to stop'
              : view.finished
                ? 'Clear timer'
                : 'Stop timer'}
        </button>
      </div>
      {stop.isError && (
        <p className="bt-timer__problem" role="alert">
          {commandProblem(stop.error)}
        </p>
      )}
    </section>
  );
}
