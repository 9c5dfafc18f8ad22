import { useSearchParams } from 'react-router';
import { MessageBar, MessageBarBody, Spinner } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { formErrorText } from '@/lib/form-errors';
import { useShop } from '@/features/shop/api/get-shop';
import { ReportsView, type ReportTab } from '@/features/reports/components/reports-view';
import { WeekPicker } from '@/features/timecards/components/week-picker';
import { currentWeek, readWeek, weekName, weekRangeText } from '@/features/timecards/week-label';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const { role } = useOffice();
  const shop = useShop();
  const [params, setParams] = useSearchParams();

  const week = readWeek(params.get('week')) ?? (shop.data ? currentWeek(shop.data) : null);
  const tab: ReportTab = params.get('report') === 'pay' ? 'pay' : 'labour';
  const update = (key: string, value: string) =>
    setParams((current) => {
      const next = new URLSearchParams(current);
      next.set(key, value);
      return next;
    });

  return (
    <>
      <PageHeader
        title="Reports"
        description={
          role === 'owner'
            ? 'Weekly labour efficiency and the pay summary, for the shop’s workweek.'
            : 'Weekly labour efficiency, for the shop’s workweek.'
        }
        actions={
          shop.data && week ? (
            <WeekPicker week={week} settings={shop.data} onChange={(next) => update('week', next)} />
          ) : undefined
        }
      />
      {shop.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(shop.error)}</MessageBarBody>
        </MessageBar>
      ) : !shop.data || !week ? (
        <Spinner label="Loading…" />
      ) : (
        <ReportsView
          week={week}
          tab={tab}
          onTab={(next) => update('report', next)}
          canSeePay={role === 'owner'}
          printTitle={(shown) =>
            `${shop.data.name} · ${shown === 'pay' ? 'Pay summary (estimate)' : 'Labour report'} · ${weekName(week, shop.data)}, ${weekRangeText(week, shop.data)}`
          }
        />
      )}
    </>
  );
}
