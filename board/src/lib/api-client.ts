import { createApiClient } from '@baytime/shared/client';
import { officeToken, wallToken } from './token-store';
import { forgetWallToken } from './wall-session';

/**
 * A 401 only drops the stored token: the screen listening to that store goes back to pairing or
 * sign-in by itself, with no page reload.
 */
export const wallApi = createApiClient({ getToken: wallToken.get, onUnauthorized: forgetWallToken });

export const officeApi = createApiClient({ getToken: officeToken.get, onUnauthorized: officeToken.clear });

/** Sign-in and pairing: a refused code or password must not drop a token that still works. */
export const publicApi = createApiClient({ getToken: () => null });
