import { createApiClient } from '@baytime/shared/client';
import { listenToken } from './listen-token';
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

/**
 * The API for what the kiosk watches while nobody may be signed in (running timers, bay names):
 * the signed-in technician's token, else the last one still valid. A 401 ends whichever it was.
 */
export const watchApi = createApiClient({
  getToken: () => session.get()?.accessToken ?? listenToken.get(),
  onUnauthorized: () => {
    if (session.get()) session.clear('expired');
    else listenToken.clear();
  },
});

/** The token `watchApi` would use now, or null: the watching stops without one. */
export const watchToken = (): string | null => session.get()?.accessToken ?? listenToken.get();
