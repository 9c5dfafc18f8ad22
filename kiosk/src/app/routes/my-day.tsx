import { lazy, Suspense, useState } from 'react';
import { Spinner } from '@fluentui/react-components';
import { useQueryClient } from '@tanstack/react-query';
import { TIMER_KIND_LABELS, type TimerDto } from '@baytime/shared';
import { useSession } from '@/lib/session';
import { useNow } from '@/hooks/use-now';
import { usePreload } from '@/hooks/use-preload';
import { clockTime } from '@/lib/format';
import { NoteIcon, TimerIcon } from '@/components/icons';
import { SheetLoading } from '@/components/sheet-loading';
import { ScreenProblem } from '@/components/screen-problem';
import { useMyDay } from '@/features/my-day/api/get-my-day';
import { useShop } from '@/features/shop/api/get-shop';
import { projectDay, type DayLine, type PendingPunch } from '@/features/my-day/project-day';
import { statusText } from '@/features/my-day/status-text';
import { partsInNotices, partsWaitText } from '@/features/my-day/parts-words';
import { FindingAnswerNotices } from '@/features/my-day/components/finding-answer-notices';
import { useFindingAnswerNotices } from '@/features/my-day/hooks/use-finding-answer-notices';
import { StatusLine } from '@/features/my-day/components/status-line';
import { ShiftActions } from '@/features/my-day/components/shift-actions';
import { JobLineList, lineContext } from '@/features/my-day/components/job-line-list';
import { HoldSheet } from '@/features/my-day/components/hold-sheet';
import { DoneSheet } from '@/features/my-day/components/done-sheet';
import { FinalChecks } from '@/features/my-day/components/final-checks';
import { useTimers } from '@/features/timers/api/get-timers';
import { useStopTimer } from '@/features/timers/api/stop-timer';
import { stillCounting } from '@/features/timers/timer-status';
import { useConfirmedPunches, useOutboxEntries } from '@/features/punches/hooks/use-outbox';
import { usePunch } from '@/features/punches/hooks/use-punch';
import '@/features/my-day/components/my-day.css';
import { queryKeys } from '@/lib/query-keys';

// Timers and findings load on first use, and are fetched ahead once the day shows.
const loadTimerPanel = () => import('@/features/timers/components/timer-panel');
const loadStartTimer = () => import('@/features/timers/components/start-timer-sheet');
const loadReading = () => import('@/features/timers/components/reading-sheet');
const loadFinding = () => import('@/features/findings/components/finding-sheet');
const TimerPanel = lazy(() => loadTimerPanel().then((m) => ({ default: m.TimerPanel })));
const StartTimerSheet = lazy(() => loadStartTimer().then((m) => ({ default: m.StartTimerSheet })));
const ReadingSheet = lazy(() => loadReading().then((m) => ({ default: m.ReadingSheet })));
const FindingSheet = lazy(() => loadFinding().then((m) => ({ default: m.FindingSheet })));
const PRELOADS = [loadTimerPanel, loadStartTimer, loadReading, loadFinding];

type OpenSheet =
  | { kind: 'hold' | 'done' | 'timer' | 'finding'; line: DayLine }
  | { kind: 'reading'; line: DayLine; timerId: number };

export function MyDayRoute() {
  const current = useSession();
  if (!current) return null;
  return <MyDayScreen technicianId={current.user.id} />;
}

function MyDayScreen({ technicianId }: { technicianId: number }) {
  const day = useMyDay(technicianId);
  const shop = useShop();
  const timers = useTimers();
  const entries = useOutboxEntries();
  const confirmed = useConfirmedPunches();
  const punch = usePunch();
  const stopTimer = useStopTimer();
  const now = useNow(1000);
  const queryClient = useQueryClient();
  const [sheet, setSheet] = useState<OpenSheet | null>(null);
  const answerNotices = useFindingAnswerNotices(day.data?.lines);

  usePreload(PRELOADS);

  if (day.isPending) {
    return (
      <div className="bt-splash">
        <Spinner size="huge" label="Loading your day…" labelPosition="below" />
      </div>
    );
  }
  if (!day.data) {
    return (
      <ScreenProblem
        title="Your day could not be loaded"
        message={day.error?.message ?? 'No answer from the shop server.'}
        onRetry={() => void day.refetch()}
      />
    );
  }

  const split = shop.data?.concurrentSplit;
  const timeZone = shop.data?.timeZone;
  const units = shop.data?.units;
  const pending: PendingPunch[] = [
    ...confirmed
      .filter((c) => c.entry.technicianId === technicianId && c.confirmedAt > day.dataUpdatedAt)
      .map((c) => c.entry.punch),
    ...entries.filter((e) => e.technicianId === technicianId).map((e) => e.punch),
  ];
  const view = projectDay(day.data, pending, day.dataUpdatedAt, split);
  const text = statusText(view, now, timeZone, split);
  const open = view.lines.filter((l) => l.status !== 'done').length;
  const partsIn = [...partsInNotices(view.lines), ...answerNotices];

  const timerByLine = new Map<number, TimerDto>();
  for (const timer of timers.data ?? []) if (timer.endedAt === null) timerByLine.set(timer.jobLineId, timer);
  const lineById = new Map(view.lines.map((line) => [line.id, line]));
  const countingTimers = (timers.data ?? []).flatMap((timer) => {
    const line = lineById.get(timer.jobLineId);
    return line && stillCounting(timer, { now, fetchedAt: timers.dataUpdatedAt })
      ? [{ id: timer.id, words: `${timer.label ?? TIMER_KIND_LABELS[timer.kind]} on ${lineContext(line)}` }]
      : [];
  });
  const close = () => setSheet(null);
  const refreshDay = () => void queryClient.invalidateQueries({ queryKey: queryKeys.myDay.all() });
  const readingTimer =
    sheet?.kind === 'reading' ? (timers.data ?? []).find((t) => t.id === sheet.timerId) : undefined;

  return (
    <div className="bt-day">
      <div className="bt-day__side">
        <StatusLine view={view} text={text} />
        <ShiftActions
          view={view}
          onPunch={punch}
          runningTimers={countingTimers}
          onStopTimers={(ids) => ids.forEach((id) => stopTimer.mutate(id))}
        />
        <FinalChecks checks={day.data.finalChecks} />
      </div>
      <section className="bt-day__main" aria-labelledby="bt-lines-title">
        <h2 id="bt-lines-title" className="bt-day__heading">
          <span>My job lines</span>
          <small>
            {day.isRefetchError
              ? `Could not refresh: as of ${clockTime(day.dataUpdatedAt, timeZone)}`
              : `${open} open · ${day.data.doneToday} done today`}
          </small>
        </h2>
        <div className="bt-day__scroll">
          {partsIn.map((notice) => (
            <p key={notice} className="bt-parts-in" role="status">
              {notice}
            </p>
          ))}
          <FindingAnswerNotices lines={view.lines} answered={view.answeredFindings} />
          <JobLineList
            view={view}
            now={now}
            split={split}
            maxConcurrentJobs={day.data.maxConcurrentJobs}
            onPunch={punch}
            onRequest={(line, request) => setSheet({ kind: request, line })}
            renderTools={(line) => (
              <>
                {!timerByLine.has(line.id) && (
                  <button
                    type="button"
                    className="bt-tool bt-tool--timer"
                    disabled={!units}
                    onClick={() => setSheet({ kind: 'timer', line })}
                  >
                    <TimerIcon /> Start timer
                  </button>
                )}
                <button
                  type="button"
                  className="bt-tool bt-tool--finding"
                  onClick={() => setSheet({ kind: 'finding', line })}
                >
                  <NoteIcon /> Add finding
                </button>
              </>
            )}
            renderPanel={(line) => {
              const timer = timerByLine.get(line.id);
              const waiting = partsWaitText(line, now, timeZone);
              if (waiting) return <p className="bt-line__parts">{waiting}</p>;
              if (!timer || !units) return null;
              return (
                <Suspense fallback={<div className="bt-timer-placeholder" />}>
                  <TimerPanel
                    timer={timer}
                    fetchedAt={timers.dataUpdatedAt}
                    units={units}
                    timeZone={timeZone}
                    onLogReading={() => setSheet({ kind: 'reading', line, timerId: timer.id })}
                  />
                </Suspense>
              );
            }}
          />
        </div>
      </section>

      {sheet?.kind === 'hold' && (
        <HoldSheet line={sheet.line} context={lineContext(sheet.line)} onClose={close} />
      )}
      {sheet?.kind === 'done' && (
        <DoneSheet line={sheet.line} context={lineContext(sheet.line)} onClose={close} />
      )}
      <Suspense fallback={<SheetLoading />}>
        {sheet?.kind === 'timer' && units && (
          <StartTimerSheet
            jobLineId={sheet.line.id}
            context={lineContext(sheet.line)}
            units={units}
            onClose={close}
          />
        )}
        {sheet?.kind === 'reading' && readingTimer && units && (
          <ReadingSheet
            timer={readingTimer}
            context={lineContext(sheet.line)}
            units={units}
            timeZone={timeZone}
            onClose={close}
          />
        )}
        {sheet?.kind === 'finding' && (
          <FindingSheet
            jobLineId={sheet.line.id}
            context={lineContext(sheet.line)}
            onClose={close}
            onSent={refreshDay}
          />
        )}
      </Suspense>
    </div>
  );
}
