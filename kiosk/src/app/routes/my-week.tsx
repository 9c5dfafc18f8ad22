import { Spinner } from '@fluentui/react-components';
import { useSearchParams } from 'react-router';
import { addIsoWeeks, parseIsoWeek } from '@baytime/shared';
import { paths } from '@/config/paths';
import { useSession } from '@/lib/session';
import { useNow } from '@/hooks/use-now';
import { ScreenProblem } from '@/components/screen-problem';
import { useTimecard } from '@/features/timecard/api/get-timecard';
import { WeekView } from '@/features/timecard/components/week-view';
import '@/features/timecard/components/week.css';

export function MyWeekRoute() {
  const current = useSession();
  if (!current) return null;
  return <MyWeekScreen technicianId={current.user.id} />;
}

function MyWeekScreen({ technicianId }: { technicianId: number }) {
  const [params] = useSearchParams();
  const asked = params.get('week') ?? undefined;
  const week = asked && parseIsoWeek(asked) ? asked : undefined;
  const card = useTimecard(technicianId, week);
  const now = useNow(60_000);

  if (card.isPending)
    return (
      <div className="bt-splash">
        <Spinner size="huge" label="Loading your week…" labelPosition="below" />
      </div>
    );
  if (!card.data)
    return (
      <ScreenProblem
        title="Your week could not be loaded"
        message={card.error?.message ?? 'No answer from the shop server.'}
        onRetry={() => void card.refetch()}
      />
    );

  const isCurrent = Date.parse(card.data.to) > now;
  return (
    <div className="bt-week-page">
      <WeekView
        card={card.data}
        previousHref={paths.myWeek.getHref(addIsoWeeks(card.data.week, -1))}
        nextHref={isCurrent ? null : paths.myWeek.getHref(addIsoWeeks(card.data.week, 1))}
        stale={card.isRefetchError}
      />
    </div>
  );
}
