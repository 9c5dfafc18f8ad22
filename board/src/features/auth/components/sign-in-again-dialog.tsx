import { Body1, Field, Input, makeStyles, tokens } from '@fluentui/react-components';
import { loginSchema, type AuthUser } from '@baytime/shared';
import { FormDialog } from '@/components/form-dialog';
import { useSchemaForm } from '@/lib/form';
import { OtherPersonError, useSignInAgain } from '../api/login';
import { useOfficeToken } from '../hooks/use-office-token';
import { officeSignIn } from '../office-sign-in';
import { showSignInError } from '../sign-in-errors';

const useStyles = makeStyles({
  who: { color: tokens.colorNeutralForeground2 },
});

/**
 * The password asked for on the page itself, for a fresh sign-in of the same person: the page under
 * the dialog, and whatever was typed on it, stays as it is.
 */
export function SignInAgainDialog({ user, onClose }: { user: AuthUser; onClose: () => void }) {
  const styles = useStyles();
  const token = useOfficeToken();
  // The e-mail the sign-in was made with; a sign-in from before it was kept asks for it as well.
  const email = officeSignIn.of(token)?.email;
  const signIn = useSignInAgain(user.id);
  const form = useSchemaForm(loginSchema, { defaultValues: { email: email ?? '', password: '' } });
  const { errors } = form.formState;

  const submit = form.handleSubmit((body) =>
    signIn.mutate(body, {
      onSuccess: onClose,
      onError: (error) => {
        if (!(error instanceof OtherPersonError))
          return showSignInError(
            form,
            error,
            email ? 'That password does not match' : 'That e-mail and password do not match',
          );
        form.setError('root.server', {
          type: 'server',
          message: `That password signs in ${error.person}. Enter ${user.name}'s password, or sign out to change who is signed in.`,
        });
      },
    }),
  );

  return (
    <FormDialog
      title="Sign in again"
      submitLabel="Sign in"
      pendingLabel="Signing in…"
      cancelLabel="Not now"
      pending={signIn.isPending}
      formError={errors.root?.server?.message}
      onSubmit={() => void submit()}
      onClose={onClose}
    >
      <Body1>
        Enter your password for a fresh sign-in. This page stays as it is, with everything you have typed.
      </Body1>
      {email ? (
        <>
          <Body1 className={styles.who}>
            {user.name} · {email}
          </Body1>
          {/* For the browser's saved passwords: the account the password belongs to. */}
          <input type="email" name="email" autoComplete="username" value={email} readOnly hidden />
        </>
      ) : (
        <Field label="E-mail" required validationMessage={errors.email?.message}>
          <Input type="email" autoComplete="username" {...form.register('email')} />
        </Field>
      )}
      <Field label="Password" required validationMessage={errors.password?.message}>
        <Input type="password" autoComplete="current-password" {...form.register('password')} />
      </Field>
    </FormDialog>
  );
}
