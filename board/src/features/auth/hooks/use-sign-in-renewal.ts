import { useEffect } from 'react';
import { useLocation } from 'react-router';
import { officeToken } from '@/lib/token-store';
import { renewSignIn } from '../api/renew-sign-in';
import { officeSignIn } from '../office-sign-in';
import { createSignInRenewer } from '../sign-in-renewal';

/** Each minute in view: nothing against the 4 hours a token has left once it is due. */
const CHECK_EVERY_MS = 60_000;

const renewer = createSignInRenewer({ tokens: officeToken, records: officeSignIn, renew: renewSignIn });

/**
 * Keeps the office signed in while someone uses it: checked on every page opened and each minute the
 * tab is in view. A tab left hidden is not renewed, and its sign-in runs out as before.
 */
export function useSignInRenewal(): void {
  const { pathname } = useLocation();
  useEffect(() => renewer.renewIfDue(), [pathname]);
  useEffect(() => {
    const check = () => {
      if (document.visibilityState === 'visible') renewer.renewIfDue();
    };
    const timer = setInterval(check, CHECK_EVERY_MS);
    document.addEventListener('visibilitychange', check);
    return () => {
      clearInterval(timer);
      document.removeEventListener('visibilitychange', check);
    };
  }, []);
}
