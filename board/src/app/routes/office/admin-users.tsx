import { MessageBar, MessageBarBody, Spinner } from '@fluentui/react-components';
import { PageHeader } from '@/components/page-header';
import { formErrorText } from '@/lib/form-errors';
import { AddUserForm } from '@/features/users/components/add-user-form';
import { useShop } from '@/features/shop/api/get-shop';
import { UsersTable } from '@/features/users/components/users-table';
import { useOffice } from './office-context';

export function Component() {
  const { user } = useOffice();
  const shop = useShop();
  return (
    <>
      <PageHeader
        title="Users"
        description="Technicians sign in at the kiosk with a badge; office staff with e-mail."
      />
      <AddUserForm />
      {shop.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(shop.error)}</MessageBarBody>
        </MessageBar>
      ) : shop.data ? (
        <UsersTable currentUserId={user.id} shop={shop.data} />
      ) : (
        <Spinner label="Loading people…" />
      )}
    </>
  );
}
