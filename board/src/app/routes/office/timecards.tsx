import { useSearchParams } from 'react-router';
import { MessageBar, MessageBarBody, Spinner } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { formErrorText } from '@/lib/form-errors';
import { useShop } from '@/features/shop/api/get-shop';
import { useUsers } from '@/lib/api/get-users';
import { TechnicianPicker } from '@/features/timecards/components/technician-picker';
import { TimecardView } from '@/features/timecards/components/timecard-view';
import { WeekPicker } from '@/features/timecards/components/week-picker';
import { currentWeek, readWeek } from '@/features/timecards/week-label';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const shop = useShop();
  const users = useUsers();
  const [params, setParams] = useSearchParams();

  const technicians = (users.data ?? []).filter((user) => user.role === 'technician');
  const asked = Number(params.get('technician'));
  const technicianId =
    technicians.find((tech) => tech.id === asked)?.id ??
    technicians.find((tech) => tech.active)?.id ??
    technicians[0]?.id ??
    null;
  const week = readWeek(params.get('week')) ?? (shop.data ? currentWeek(shop.data) : null);

  const update = (changes: Record<string, string>) =>
    setParams((current) => {
      const next = new URLSearchParams(current);
      for (const [key, value] of Object.entries(changes)) next.set(key, value);
      return next;
    });

  const failed = shop.error ?? users.error;
  return (
    <>
      <PageHeader
        title="Timecards"
        description="Each technician’s punches, shifts, breaks and jobs, week by week, in the shop’s time zone."
        actions={
          shop.data && week ? (
            <>
              <TechnicianPicker
                technicians={technicians}
                value={technicianId}
                onChange={(id) => update({ technician: String(id) })}
              />
              <WeekPicker week={week} settings={shop.data} onChange={(next) => update({ week: next })} />
            </>
          ) : undefined
        }
      />
      {failed ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(failed)}</MessageBarBody>
        </MessageBar>
      ) : shop.isPending || users.isPending || !week ? (
        <Spinner label="Loading…" />
      ) : technicianId === null ? (
        <MessageBar intent="info">
          <MessageBarBody>No technicians yet: add them under Admin, Users.</MessageBarBody>
        </MessageBar>
      ) : (
        <TimecardView technicianId={technicianId} week={week} canCorrect />
      )}
    </>
  );
}
