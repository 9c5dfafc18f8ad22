import type { UseFormReturn } from 'react-hook-form';
import type { LoginBody } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { showServerErrors } from '@/lib/form';

/** Puts a refused sign-in on its form: `notMatched` at the password for a wrong e-mail or password. */
export function showSignInError(
  form: Pick<UseFormReturn<LoginBody>, 'setError'>,
  error: unknown,
  notMatched: string,
): void {
  const refused = (message: string) => form.setError('root.server', { type: 'server', message });
  if (!(error instanceof ApiError)) return refused('Sign-in failed. Try again.');
  if (error.isNetwork) return refused('No connection to the shop server. Check the network and try again.');
  if (error.status === 401) return form.setError('password', { type: 'server', message: notMatched });
  if (error.status === 429) return refused(error.message);
  showServerErrors(form, error);
}
