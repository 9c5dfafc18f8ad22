import type { JobLineStatus } from '@baytime/shared';
import {
  CheckIcon,
  FlagIcon,
  PauseIcon,
  PlayIcon,
  QueueIcon,
  StopIcon,
  WrenchIcon,
} from '@/components/icons';
import { bookHours, hoursMinutes } from '@/lib/format';
import type { DayLine } from '../project-day';

const STATUS_WORDS: Record<JobLineStatus, string> = {
  queued: 'Queued',
  working: 'Working',
  held: 'Held',
  done: 'Done',
};

const STATUS_ICONS = { queued: QueueIcon, working: WrenchIcon, held: PauseIcon, done: CheckIcon } as const;

export type ClockAction =
  | { kind: 'clock-on' }
  | { kind: 'clock-off' }
  | { kind: 'switch'; fromLabel: string }
  | { kind: 'none'; hint: string | null };

export interface JobLineCardProps {
  line: DayLine;
  mine: number;
  all: number;
  action: ClockAction;
  onClockOn: () => void;
  onClockOff: () => void;
}

export function JobLineCard({ line, mine, all, action, onClockOn, onClockOff }: JobLineCardProps) {
  const StatusIcon = STATUS_ICONS[line.status];
  const book = line.bookHours * 3600;
  const share = book > 0 ? all / book : 0;
  const over = share > 1;
  const statusWord =
    line.status === 'held' && line.holdReason ? `Held · ${line.holdReason}` : STATUS_WORDS[line.status];

  return (
    <article
      className={`bt-line bt-line--${line.status}${line.clockedOn ? ' is-on' : ''}`}
      aria-label={`RO ${line.repairOrderNumber} line ${line.lineNo}`}
    >
      <div className="bt-line__body">
        <header className="bt-line__top">
          <span className="bt-line__ro">
            RO {line.repairOrderNumber} · line {line.lineNo}
          </span>
          {line.bayName && <span className="bt-line__bay">{line.bayName}</span>}
          {(line.priority === 'urgent' || line.priority === 'high') && (
            <span className={`bt-line__priority bt-line__priority--${line.priority}`}>
              <FlagIcon /> {line.priority === 'urgent' ? 'Urgent' : 'High'}
            </span>
          )}
          <span className="bt-line__state">
            <StatusIcon /> {statusWord}
          </span>
        </header>
        <h3 className="bt-line__title">{line.title}</h3>
        <p className="bt-line__vehicle">{line.vehicle}</p>
        <dl className="bt-line__times">
          <div>
            <dt>Book</dt>
            <dd>{bookHours(line.bookHours)}</dd>
          </div>
          <div>
            <dt>Mine</dt>
            <dd className={line.clockedOn ? 'is-running' : undefined}>{hoursMinutes(mine)}</dd>
          </div>
          <div>
            <dt>All techs</dt>
            <dd>{hoursMinutes(all)}</dd>
          </div>
        </dl>
        <div
          className={`bt-line__bar${over ? ' is-over' : ''}`}
          role="img"
          aria-label={`${Math.round(share * 100)} % of book time used`}
        >
          <span style={{ width: `${Math.min(100, share * 100)}%` }} />
        </div>
      </div>

      <div className="bt-line__actions">
        {action.kind === 'clock-on' && (
          <button type="button" className="bt-action bt-action--go" onClick={onClockOn}>
            <PlayIcon /> Clock on
          </button>
        )}
        {action.kind === 'switch' && (
          <button type="button" className="bt-action bt-action--go bt-action--two-line" onClick={onClockOn}>
            <PlayIcon />
            <span>
              Clock on
              <small>and off {action.fromLabel}</small>
            </span>
          </button>
        )}
        {action.kind === 'clock-off' && (
          <button type="button" className="bt-action bt-action--stop" onClick={onClockOff}>
            <StopIcon /> Clock off
          </button>
        )}
        {action.kind === 'none' && action.hint && <p className="bt-line__hint">{action.hint}</p>}
        {line.pending && <span className="bt-pending-tag">Sending…</span>}
      </div>
    </article>
  );
}
