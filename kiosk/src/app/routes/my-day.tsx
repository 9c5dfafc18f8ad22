import { Spinner } from '@fluentui/react-components';
import { useSession } from '@/lib/session';
import { useNow } from '@/hooks/use-now';
import { clockTime } from '@/lib/format';
import { useMyDay } from '@/features/my-day/api/get-my-day';
import { useShop } from '@/features/shop/api/get-shop';
import { useLiveMyDay } from '@/features/my-day/hooks/use-live-my-day';
import { projectDay, type PendingPunch } from '@/features/my-day/project-day';
import { statusText } from '@/features/my-day/status-text';
import { StatusLine } from '@/features/my-day/components/status-line';
import { ShiftActions } from '@/features/my-day/components/shift-actions';
import { JobLineList } from '@/features/my-day/components/job-line-list';
import { useConfirmedPunches, useOutboxEntries } from '@/features/punches/hooks/use-outbox';
import { usePunch } from '@/features/punches/hooks/use-punch';
import { ScreenProblem } from '@/components/screen-problem';
import '@/features/my-day/components/my-day.css';

export function MyDayRoute() {
  const current = useSession();
  if (!current) return null;
  return <MyDayScreen technicianId={current.user.id} />;
}

function MyDayScreen({ technicianId }: { technicianId: number }) {
  const day = useMyDay(technicianId);
  const shop = useShop();
  const entries = useOutboxEntries();
  const confirmed = useConfirmedPunches();
  const punch = usePunch();
  const now = useNow(1000);
  useLiveMyDay(technicianId, day.data?.lines.map((l) => l.id) ?? []);

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
  const pending: PendingPunch[] = [
    ...confirmed
      .filter((c) => c.entry.technicianId === technicianId && c.confirmedAt > day.dataUpdatedAt)
      .map((c) => c.entry.punch),
    ...entries.filter((e) => e.technicianId === technicianId).map((e) => e.punch),
  ];
  const view = projectDay(day.data, pending, day.dataUpdatedAt, split);
  const text = statusText(view, now, timeZone, split);
  const open = view.lines.filter((l) => l.status !== 'done').length;

  return (
    <div className="bt-day">
      <div className="bt-day__side">
        <StatusLine view={view} text={text} />
        <ShiftActions view={view} onPunch={punch} />
      </div>
      <section className="bt-day__main" aria-labelledby="bt-lines-title">
        <h2 id="bt-lines-title" className="bt-day__heading">
          <span>My job lines</span>
          <small>
            {day.isRefetchError
              ? `Could not refresh: as of ${clockTime(day.dataUpdatedAt, timeZone)}`
              : `${open} open · ${view.lines.length - open} done`}
          </small>
        </h2>
        <div className="bt-day__scroll">
          <JobLineList
            view={view}
            now={now}
            split={split}
            maxConcurrentJobs={day.data.maxConcurrentJobs}
            onPunch={punch}
          />
        </div>
      </section>
    </div>
  );
}
