import type { SignInAnswer } from '@baytime/shared';
import { officeApi } from '@/lib/api-client';

/** A fresh token for the office sign-in in use; a 401 signs the office out as any request's does. */
export function renewSignIn(): Promise<SignInAnswer> {
  return officeApi.post<SignInAnswer>('/auth/renew');
}
