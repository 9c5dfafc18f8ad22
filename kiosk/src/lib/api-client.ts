import { createApiClient } from '@baytime/shared/client';
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
