import { makeStyles, tokens } from '@fluentui/react-components';
import type { UserDto } from '@baytime/shared';
import { FormDialog } from '@/components/form-dialog';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useUpdateUser } from '../api/update-user';
import { editUserFormSchema, fieldsOf } from '../user-form';
import { UserFieldsGrid } from './user-fields';

const useStyles = makeStyles({
  grid: { display: 'grid', gap: tokens.spacingVerticalM },
});

/** Name, role, badge, skill level, and a new PIN or password: audited. Rates change from a date in the pay dialog. */
export function EditUserDialog({ user, onClose }: { user: UserDto; onClose: () => void }) {
  const styles = useStyles();
  const update = useUpdateUser();
  const form = useSchemaForm(editUserFormSchema, { defaultValues: fieldsOf(user) });
  return (
    <FormDialog
      title={`Edit ${user.name}`}
      submitLabel="Save"
      pending={update.isPending}
      formError={form.formState.errors.root?.server?.message}
      onClose={onClose}
      onSubmit={form.handleSubmit((body) =>
        update.mutate(
          { id: user.id, ...body },
          {
            onSuccess: onClose,
            onError: (error) => showServerErrors(form, error),
          },
        ),
      )}
    >
      <div className={styles.grid}>
        <UserFieldsGrid form={form} editing />
      </div>
    </FormDialog>
  );
}
