import { MessageBar, MessageBarBody, Spinner } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { formErrorText } from '@/lib/form-errors';
import { RepairOrderForm } from '@/features/repair-order-intake/components/repair-order-form';
import { useShop } from '@/features/shop/api/get-shop';
import { useOffice } from './office-context';

export { PageError as ErrorBoundary } from './page-error';

export function Component() {
  const shop = useShop();
  const { user } = useOffice();
  return (
    <>
      <PageHeader
        title="New repair order"
        description="Customer, vehicle, what they asked for and the job lines. Fields marked * are needed."
      />
      {shop.isPending ? (
        <Spinner label="Loading the shop's settings…" />
      ) : shop.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(shop.error)}</MessageBarBody>
        </MessageBar>
      ) : (
        <RepairOrderForm
          timeZone={shop.data.timeZone}
          openingHours={shop.data.openingHours}
          units={shop.data.units}
          userId={user.id}
        />
      )}
    </>
  );
}
