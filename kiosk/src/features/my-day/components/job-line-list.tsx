import type { ReactNode } from 'react';
import { PUNCH_WORDS } from '@baytime/shared';
import { commandProblem } from '@/lib/commands';
import { useResumeLine } from '../api/resume-line';
import { lineSeconds, type ConcurrentSplit, type DayLine, type DayView } from '../project-day';
import { clockAction, lineLabel } from '../line-actions';
import { JobLineCard } from './job-line-card';
import type { ShiftPunch } from './shift-actions';

/** What a tap on a card's tool asks for; the screen opens the matching sheet. */
export type LineRequest = 'hold' | 'done';

export interface JobLineListProps {
  view: DayView;
  now: number;
  split?: ConcurrentSplit;
  maxConcurrentJobs: number;
  onPunch: (punches: ShiftPunch[]) => void;
  onRequest: (line: DayLine, request: LineRequest) => void;
  renderTools?: (line: DayLine) => ReactNode;
  renderPanel?: (line: DayLine) => ReactNode;
}

/** "RO 4521 · line 1 · Bay 1 — Automatic transmission fluid and filter service" for a sheet's head. */
export const lineContext = (line: DayLine) =>
  `RO ${line.repairOrderNumber} · line ${line.lineNo}${line.bayName ? ` · ${line.bayName}` : ''} — ${line.title}`;

const PRIORITY = { urgent: 0, high: 1, normal: 2, low: 3 } as const;

/**
 * Priority first, done lines last. A tap never reorders the list: a card that jumped away under a
 * gloved finger would let the next tap land on another line.
 */
function sortLines(lines: readonly DayLine[]): DayLine[] {
  return [...lines].sort(
    (a, b) =>
      Number(a.status === 'done') - Number(b.status === 'done') ||
      PRIORITY[a.priority] - PRIORITY[b.priority] ||
      a.repairOrderNumber.localeCompare(b.repairOrderNumber, undefined, { numeric: true }) ||
      a.lineNo - b.lineNo,
  );
}

export function JobLineList({
  view,
  now,
  split,
  maxConcurrentJobs,
  onPunch,
  onRequest,
  renderTools,
  renderPanel,
}: JobLineListProps) {
  const resume = useResumeLine();

  if (view.lines.length === 0) {
    return (
      <div className="bt-lines-empty">
        <p>No job lines assigned to you yet.</p>
        <p>The foreman's assignments show up here at once.</p>
      </div>
    );
  }
  return (
    <ul className="bt-lines" aria-label="My job lines">
      {sortLines(view.lines).map((line) => {
        const { mine, all } = lineSeconds(view, line, now, split);
        const action = clockAction(view, line, maxConcurrentJobs);
        const running = view.lines.filter((l) => l.clockedOn);
        const resumingThis = resume.variables === line.id;
        return (
          <li key={line.id}>
            <JobLineCard
              line={line}
              mine={mine}
              all={all}
              action={action}
              onClockOn={() =>
                onPunch([
                  ...(action.kind === 'switch'
                    ? running.map<ShiftPunch>((r) => ({
                        kind: 'job-off',
                        jobLineId: r.id,
                        label: `${PUNCH_WORDS['job-off']} ${lineLabel(r)}`,
                      }))
                    : []),
                  {
                    kind: 'job-on',
                    jobLineId: line.id,
                    label: `${PUNCH_WORDS['job-on']} ${lineLabel(line)}`,
                  },
                ])
              }
              onClockOff={() =>
                onPunch([
                  {
                    kind: 'job-off',
                    jobLineId: line.id,
                    label: `${PUNCH_WORDS['job-off']} ${lineLabel(line)}`,
                  },
                ])
              }
              onHold={() => onRequest(line, 'hold')}
              onDone={() => onRequest(line, 'done')}
              onResume={() =>
                resume.mutate(line.id, {
                  onSuccess: () => {
                    if (action.kind === 'resume' && action.clockOn)
                      onPunch([
                        {
                          kind: 'job-on',
                          jobLineId: line.id,
                          label: `${PUNCH_WORDS['job-on']} ${lineLabel(line)}`,
                        },
                      ]);
                  },
                })
              }
              resuming={resume.isPending && resumingThis}
              problem={resume.isError && resumingThis ? commandProblem(resume.error) : null}
              tools={renderTools?.(line)}
              panel={renderPanel?.(line)}
            />
          </li>
        );
      })}
    </ul>
  );
}
