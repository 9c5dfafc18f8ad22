import { useSearchParams } from 'react-router';
import { MessageBar, MessageBarBody, Spinner } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { formErrorText } from '@/lib/form-errors';
import { ExceptionsView } from '@/features/exceptions/components/exceptions-view';
import { useShop } from '@/features/shop/api/get-shop';
import { WeekPicker } from '@/features/timecards/components/week-picker';
import { currentWeek, readWeek } from '@/features/timecards/week-label';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const shop = useShop();
  const [params, setParams] = useSearchParams();
  const week = readWeek(params.get('week')) ?? (shop.data ? currentWeek(shop.data) : null);
  return (
    <>
      <PageHeader
        title="Exceptions"
        description="Late punches held for review, lines done without clocked time, open shifts and breaks, long rests and short meals: shop-wide, week by week."
        actions={
          shop.data && week ? (
            <WeekPicker
              week={week}
              settings={shop.data}
              onChange={(next) =>
                setParams((current) => new URLSearchParams({ ...Object.fromEntries(current), week: next }))
              }
            />
          ) : undefined
        }
      />
      {shop.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(shop.error)}</MessageBarBody>
        </MessageBar>
      ) : !week ? (
        <Spinner label="Loading…" />
      ) : (
        <ExceptionsView week={week} />
      )}
    </>
  );
}
