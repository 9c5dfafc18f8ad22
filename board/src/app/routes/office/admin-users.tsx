import { PageHeader } from '@/components/page-header';
import { AddUserForm } from '@/features/users/components/add-user-form';
import { UsersTable } from '@/features/users/components/users-table';
import { useOffice } from './office-context';

export function Component() {
  const { user } = useOffice();
  return (
    <>
      <PageHeader
        title="Users"
        description="Technicians sign in at the kiosk with a badge; office staff with e-mail."
      />
      <AddUserForm />
      <UsersTable currentUserId={user.id} />
    </>
  );
}
