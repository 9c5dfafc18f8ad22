import { officeApi } from '@/lib/api-client';
import type { OfficeSignInAnswer } from '@baytime/shared';

/** A fresh token for the office sign-in in use; a 401 signs the office out as any request's does. */
export function renewSignIn(): Promise<OfficeSignInAnswer> {
  return officeApi.post<OfficeSignInAnswer>('/auth/renew');
}
