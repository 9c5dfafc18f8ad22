import { useMutation } from '@tanstack/react-query';
import type { BadgeLoginBody, SignInAnswer } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { api } from '@/lib/api-client';
import { sendCommand } from '@/lib/commands';
import { durationWords } from '@/lib/format';

/** `POST /api/auth/badge` → `{ accessToken, user }`. */
/** Punches waiting on the tablet go first, so a sign-in finds its offline punches on the server. */
export const signInWithBadge = (body: BadgeLoginBody) =>
  sendCommand(() => api.post<SignInAnswer>('/auth/badge', body));

export function useBadgeSignIn() {
  return useMutation({ mutationFn: signInWithBadge, retry: false });
}

export const NO_CONNECTION = 'No connection to the shop server. Check the Wi-Fi and try again.';

/** Why a sign-in failed, in words a technician at the tablet can act on. */
export function signInRefusal(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Try again.';
  if (error.isNetwork) return NO_CONNECTION;
  if (error.status === 401) return 'Badge or PIN not recognised';
  // The server says how long the lock lasts.
  if (error.status === 429) return error.message;
  if (error.status === 400) return Object.values(error.fieldErrors)[0] ?? 'Check the badge number and PIN';
  if (error.status === 403) return 'This badge may not use the kiosk. Ask the foreman.';
  if (error.status >= 500) return 'The shop server had a problem. Try again in a moment.';
  return error.message;
}

/** When a refused sign-in may be tried again (ms), from the server's `Retry-After`; null if it did not say. */
export function signInLockedUntil(error: unknown, nowMs: number): number | null {
  if (!(error instanceof ApiError) || error.status !== 429 || error.retryAfterSeconds === null) return null;
  return nowMs + error.retryAfterSeconds * 1000;
}

/** "Too many tries. Try again in 4 min." — counted down from the server's lock. */
export function lockText(secondsLeft: number): string {
  return `Too many tries. Try again in ${durationWords(Math.max(1, secondsLeft))}.`;
}
