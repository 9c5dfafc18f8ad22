import { FormErrorBar } from '@/components/form-error-bar';
import { useState } from 'react';
import {
  Button,
  Field,
  Input,
  Link,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { loginSchema, type Role } from '@baytime/shared';
import { paths } from '@/config/paths';
import { useSchemaForm } from '@/lib/form';
import { isOfficeRole, useLogin } from '../api/login';
import { showSignInError } from '../sign-in-errors';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  submit: { marginTop: tokens.spacingVerticalS },
});

export function SignInForm() {
  const styles = useStyles();
  const login = useLogin();
  const form = useSchemaForm(loginSchema, { defaultValues: { email: '', password: '' } });
  const { errors } = form.formState;
  const [wrongApp, setWrongApp] = useState<Role | null>(null);

  const submit = form.handleSubmit((body) => {
    setWrongApp(null);
    login.mutate(body, {
      onSuccess: ({ user }) => {
        if (!isOfficeRole(user.role)) setWrongApp(user.role);
      },
      onError: (error) => showSignInError(form, error, 'That e-mail and password do not match'),
    });
  });

  return (
    <form className={styles.form} onSubmit={(event) => void submit(event)} noValidate aria-label="Sign in">
      {wrongApp === 'technician' && (
        <MessageBar intent="warning">
          <MessageBarBody>
            <MessageBarTitle>Use the kiosk</MessageBarTitle>
            Technicians sign in with their badge and PIN on the <Link href={paths.kiosk}>shop kiosk</Link>.
          </MessageBarBody>
        </MessageBar>
      )}
      {wrongApp === 'display' && (
        <MessageBar intent="warning">
          <MessageBarBody>
            <MessageBarTitle>This is a wall screen</MessageBarTitle>
            Wall screens are paired with a code and show the <Link href={paths.wall}>board</Link>.
          </MessageBarBody>
        </MessageBar>
      )}
      <FormErrorBar message={errors.root?.server?.message ?? null} />
      <Field label="E-mail" required validationMessage={errors.email?.message}>
        <Input type="email" autoComplete="username" size="large" {...form.register('email')} />
      </Field>
      <Field label="Password" required validationMessage={errors.password?.message}>
        <Input type="password" autoComplete="current-password" size="large" {...form.register('password')} />
      </Field>
      <Button
        className={styles.submit}
        appearance="primary"
        size="large"
        type="submit"
        disabled={login.isPending}
      >
        {login.isPending ? 'Signing in…' : 'Sign in'}
      </Button>
    </form>
  );
}
