import { createTokenStore } from '@/lib/token-store';
import { createSignInRecords } from './sign-in-end';

/** The office's sign-in record, beside its token in localStorage: shared by every tab, as the token is. */
export const officeSignIn = createSignInRecords(createTokenStore('baytime.office.sign-in'));
