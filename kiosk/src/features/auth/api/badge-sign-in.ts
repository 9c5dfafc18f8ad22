import { useMutation } from '@tanstack/react-query';
import type { BadgeLoginBody, SignInAnswer } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';

/** `POST /api/auth/badge` → `{ accessToken, user }`. */
/** Punches waiting on the tablet go first, so a sign-in finds its offline punches on the server. */
export const signInWithBadge = (body: BadgeLoginBody) =>
  sendCommand(() => api.post<SignInAnswer>('/auth/badge', body));

export function useBadgeSignIn() {
  return useMutation({ mutationFn: signInWithBadge, retry: false });
}

/** Why a sign-in failed, in words a technician at the tablet can act on. */
export function signInRefusal(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Try again.';
  if (error.isNetwork) return 'No connection to the shop server. Check the Wi-Fi and try again.';
  if (error.status === 401) return 'Badge or PIN not recognised';
  // The server says how long the lock lasts.
  if (error.status === 429) return error.message;
  if (error.status === 400) return Object.values(error.fieldErrors)[0] ?? 'Check the badge number and PIN';
  if (error.status === 403) return 'This badge may not use the kiosk. Ask the foreman.';
  if (error.status >= 500) return 'The shop server had a problem. Try again in a moment.';
  return error.message;
}
