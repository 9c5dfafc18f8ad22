import { useState } from 'react';
import {
  Button,
  Card,
  MessageBar,
  MessageBarBody,
  Subtitle2,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { UserDto } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { FormErrorBar } from '@/components/form-error-bar';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { useCreateUser } from '../api/create-user';
import { addRefusal, addUserFormSchema, EMPTY_USER } from '../user-form';
import { PAY_FIELD_OF } from './pay-fields';
import { UserFieldsGrid } from './user-fields';

const useStyles = makeStyles({
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  grid: {
    display: 'grid',
    gridTemplateColumns: 'repeat(auto-fill, minmax(14rem, 1fr))',
    gap: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
    alignItems: 'start',
  },
  actions: {
    display: 'flex',
    gap: tokens.spacingHorizontalM,
    alignItems: 'center',
    marginTop: tokens.spacingVerticalL,
  },
});

export function AddUserForm({ onAdded }: { onAdded?: (user: UserDto) => void }) {
  const styles = useStyles();
  const create = useCreateUser();
  const form = useSchemaForm(addUserFormSchema, { defaultValues: EMPTY_USER });
  const [added, setAdded] = useState<string | null>(null);
  const tech = form.watch('role') === 'technician';

  const submit = form.handleSubmit((body) => {
    setAdded(null);
    create.mutate(body, {
      onSuccess: (user) => {
        form.reset({ ...EMPTY_USER, role: form.getValues('role') });
        setAdded(`${user.name} was added.`);
        onAdded?.(user);
      },
      onError: (error) => {
        if (error instanceof ApiError && error.status === 409) {
          const refusal = addRefusal(error.message, tech);
          form.setError(refusal.field ?? 'root.server', { type: 'server', message: refusal.message });
        } else showServerErrors(form, error, PAY_FIELD_OF);
      },
    });
  });

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Add a person</Subtitle2>
      <form onSubmit={(event) => void submit(event)} noValidate>
        <div className={styles.grid}>
          <UserFieldsGrid form={form} />
        </div>
        <FormErrorBar message={form.formState.errors.root?.server?.message ?? null} />
        {added && (
          <MessageBar intent="success">
            <MessageBarBody>{added}</MessageBarBody>
          </MessageBar>
        )}
        <div className={styles.actions}>
          <Button appearance="primary" type="submit" disabled={create.isPending}>
            {create.isPending ? 'Adding…' : tech ? 'Add technician' : 'Add office user'}
          </Button>
        </div>
      </form>
    </Card>
  );
}
