import { useSyncExternalStore } from 'react';
import { officeToken } from '@/lib/token-store';
import { officeSignIn } from '../office-sign-in';
import { createSignInEndWatch, type SignInEndNotice } from '../sign-in-end';

const watch = createSignInEndWatch({ tokens: officeToken, records: officeSignIn });

/** When the office's sign-in ends, from a few minutes before, once it can be renewed no longer; else null. */
export function useSignInEnd(): SignInEndNotice | null {
  return useSyncExternalStore(watch.subscribe, watch.get, watch.get);
}
