import { useMutation } from '@tanstack/react-query';
import type { PairScreenBody } from '@baytime/shared';
import { ApiError } from '@baytime/shared/client';
import { api } from '@/lib/api-client';
import { device } from '@/lib/device';

/** `POST /api/auth/kiosks/pair` with the code made in Admin → Kiosks → the kiosk's own token. */
export const pairKiosk = (body: PairScreenBody) =>
  api
    .post<{ accessToken: string }>('/auth/kiosks/pair', body)
    .then(({ accessToken }) => device.set(accessToken));

export function usePairKiosk() {
  return useMutation({ mutationFn: pairKiosk, retry: false });
}

export function pairingRefusal(error: unknown): string {
  if (!(error instanceof ApiError)) return 'Something went wrong. Try again.';
  if (error.isNetwork) return 'No connection to the shop server. Pair the tablet when the Wi-Fi works.';
  if (error.status === 401) return 'That code is unknown or has expired: make a new one in the office.';
  if (error.status === 429) return error.message;
  return Object.values(error.fieldErrors)[0] ?? error.message;
}
