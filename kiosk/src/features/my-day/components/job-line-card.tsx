import type { ReactNode } from 'react';
import { JOB_LINE_STATUS_WORDS, PRIORITY_WORDS, PUNCH_WORDS } from '@baytime/shared';
import {
  CheckIcon,
  MeaningGlyph,
  PauseIcon,
  PlayIcon,
  QueueIcon,
  StopIcon,
  WrenchIcon,
} from '@/components/icons';
import { formatBookHours, formatHours } from '@/lib/format';
import { lineStatusWord, type ClockAction } from '../line-actions';
import type { DayLine } from '../project-day';

const STATUS_ICONS = {
  queued: QueueIcon,
  working: WrenchIcon,
  held: PauseIcon,
  done: CheckIcon,
  cancelled: StopIcon,
} as const;

export interface JobLineCardProps {
  line: DayLine;
  mine: number;
  all: number;
  action: ClockAction;
  onClockOn: () => void;
  onClockOff: () => void;
  onHold: () => void;
  onResume: () => void;
  onDone: () => void;
  /** A resume on its way, or why it did not go. */
  resuming?: boolean;
  problem?: string | null;
  /** Tools other features add to the row (start a timer, add a finding). */
  tools?: ReactNode;
  /** A running timer's panel. */
  panel?: ReactNode;
}

export function JobLineCard({
  line,
  mine,
  all,
  action,
  onClockOn,
  onClockOff,
  onHold,
  onResume,
  onDone,
  resuming,
  problem,
  tools,
  panel,
}: JobLineCardProps) {
  const StatusIcon = STATUS_ICONS[line.status];
  const book = line.bookHours * 3600;
  const share = book > 0 ? all / book : 0;
  const over = share > 1;
  const statusWord = lineStatusWord(line);
  const open = line.status !== 'done';

  return (
    <article
      className={`bt-line bt-line--${line.status}${line.clockedOn ? ' is-on' : ''}`}
      aria-label={`RO ${line.repairOrderNumber} line ${line.lineNo}`}
    >
      <header className="bt-line__top">
        <div className="bt-line__tags">
          <span className="bt-line__ro">
            RO {line.repairOrderNumber} · line {line.lineNo}
          </span>
          {line.bayName && <span className="bt-line__bay">{line.bayName}</span>}
          {(line.priority === 'urgent' || line.priority === 'high') && (
            <span className={`bt-line__priority bt-line__priority--${line.priority}`}>
              <MeaningGlyph name="priority" /> {PRIORITY_WORDS[line.priority]}
            </span>
          )}
        </div>
        <span className="bt-line__state">
          <StatusIcon /> {statusWord}
        </span>
      </header>

      <div className="bt-line__body">
        <h3 className="bt-line__title">{line.title}</h3>
        <p className="bt-line__vehicle">{line.vehicle}</p>
        <p className="bt-line__concern">Concern: {line.concern}</p>
        <dl className="bt-line__times">
          <div>
            <dt>Book</dt>
            <dd>{formatBookHours(line.bookHours)}</dd>
          </div>
          <div>
            <dt>Mine</dt>
            <dd className={line.clockedOn ? 'is-running' : undefined}>{formatHours(mine)}</dd>
          </div>
          <div>
            <dt>All techs</dt>
            <dd>{formatHours(all)}</dd>
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
            <PlayIcon /> {PUNCH_WORDS['job-on']}
          </button>
        )}
        {action.kind === 'switch' && (
          <button type="button" className="bt-action bt-action--go bt-action--two-line" onClick={onClockOn}>
            <PlayIcon />
            <span>
              {PUNCH_WORDS['job-on']}
              <small>and off {action.fromLabel}</small>
            </span>
          </button>
        )}
        {action.kind === 'clock-off' && (
          <button type="button" className="bt-action bt-action--stop" onClick={onClockOff}>
            <StopIcon /> {PUNCH_WORDS['job-off']}
          </button>
        )}
        {action.kind === 'resume' && (
          <button type="button" className="bt-action bt-action--go" onClick={onResume} disabled={resuming}>
            <PlayIcon /> {resuming ? 'Resuming…' : action.clockOn ? 'Resume and clock on' : 'Resume'}
          </button>
        )}
        {action.kind === 'none' && action.hint && <p className="bt-line__hint">{action.hint}</p>}
        {line.pending && <span className="bt-pending-tag">Sending…</span>}
      </div>

      {panel && <div className="bt-line__panel">{panel}</div>}

      {problem && (
        <p className="bt-line__problem" role="alert">
          {problem}
        </p>
      )}

      {open && (
        <div className="bt-line__tools" role="group" aria-label="More for this line">
          {line.status !== 'held' && (
            <button type="button" className="bt-tool bt-tool--hold" onClick={onHold}>
              <PauseIcon /> Hold
            </button>
          )}
          {tools}
          <button type="button" className="bt-tool bt-tool--done" onClick={onDone}>
            <CheckIcon /> {JOB_LINE_STATUS_WORDS.done}
          </button>
        </div>
      )}
    </article>
  );
}
