import { createApiClient } from '@baytime/shared/client';
import { device } from './device';
import { session } from './session';

/** The API as the signed-in technician. A 401 ends the session; the router then shows the keypad. */
export const api = createApiClient({
  getToken: () => session.get()?.accessToken ?? null,
  onUnauthorized: () => session.clear('expired'),
});

/** The API with a given token, for punches queued by a technician who may have signed out since. */
export function apiWithToken(token: string) {
  return createApiClient({ getToken: () => token });
}

/** The token `watchApi` would use now, or null: the watching stops without one. */
export const watchToken = (): string | null => session.get()?.accessToken ?? device.token();

/**
 * The API for what the kiosk watches whether or not anyone is signed in (running timers, bay names):
 * the signed-in technician's token, else the tablet's own, which the server lets read them and do
 * nothing else. A 401 ends the sign-in, or for the tablet's token its pairing (revoked in the office).
 */
export const watchApi = createApiClient({
  getToken: watchToken,
  onUnauthorized: () => {
    if (session.get()) session.clear('expired');
    else device.forget();
  },
});
