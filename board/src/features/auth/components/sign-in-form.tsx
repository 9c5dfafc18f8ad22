import { FormErrorBar } from '@/components/form-error-bar';
import { useState, type FormEvent } from 'react';
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
import { loginSchema, type LoginBody, type Role } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { paths } from '@/config/paths';
import { isOfficeRole, useLogin } from '../api/login';

const useStyles = makeStyles({
  form: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  submit: { marginTop: tokens.spacingVerticalS },
});

type FieldErrors = Partial<Record<keyof LoginBody, string>>;

export function SignInForm() {
  const styles = useStyles();
  const login = useLogin();
  const [values, setValues] = useState<LoginBody>({ email: '', password: '' });
  const [fieldErrors, setFieldErrors] = useState<FieldErrors>({});
  const [formError, setFormError] = useState<string | null>(null);
  const [wrongApp, setWrongApp] = useState<Role | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    setFormError(null);
    setWrongApp(null);
    const parsed = loginSchema.safeParse(values);
    if (!parsed.success) {
      const errors: FieldErrors = {};
      for (const issue of parsed.error.issues) {
        const key = issue.path[0] as keyof LoginBody;
        errors[key] ??=
          key === 'email'
            ? values.email.trim()
              ? 'That is not an e-mail address'
              : 'Enter your e-mail address'
            : 'Enter your password';
      }
      setFieldErrors(errors);
      return;
    }
    setFieldErrors({});
    login.mutate(parsed.data, {
      onSuccess: ({ user }) => {
        if (!isOfficeRole(user.role)) setWrongApp(user.role);
      },
      onError: (error) => {
        if (!(error instanceof ApiError)) return setFormError('Sign-in failed. Try again.');
        if (error.isNetwork)
          return setFormError('No connection to the shop server. Check the network and try again.');
        if (error.status === 401)
          return setFieldErrors({ password: 'That e-mail and password do not match' });
        if (error.status === 429) return setFormError(error.message);
        const { email, password } = error.fieldErrors;
        if (email || password) return setFieldErrors({ email, password });
        setFormError(error.message || 'Sign-in failed. Try again.');
      },
    });
  };

  const set = (key: keyof LoginBody) => (_: unknown, data: { value: string }) => {
    setValues((current) => ({ ...current, [key]: data.value }));
    if (fieldErrors[key]) setFieldErrors((current) => ({ ...current, [key]: undefined }));
  };

  return (
    <form className={styles.form} onSubmit={submit} noValidate aria-label="Sign in">
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
      <FormErrorBar message={formError} />
      <Field label="E-mail" required validationMessage={fieldErrors.email}>
        <Input
          type="email"
          name="email"
          autoComplete="username"
          value={values.email}
          onChange={set('email')}
          size="large"
        />
      </Field>
      <Field label="Password" required validationMessage={fieldErrors.password}>
        <Input
          type="password"
          name="password"
          autoComplete="current-password"
          value={values.password}
          onChange={set('password')}
          size="large"
        />
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
