import { createApiClient } from '@baytime/shared/client';
import { officeToken } from './token-store';

/** A 401 only drops the stored token: the office goes back to its sign-in page by itself, with no reload. */
export const officeApi = createApiClient({ getToken: officeToken.get, onUnauthorized: officeToken.clear });

/** Sign-in and pairing: a refused code or password must not drop a token that still works. */
export const publicApi = createApiClient({ getToken: () => null });
