import { useState } from 'react';
import {
  Button,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { AuthUser } from '@baytime/shared';
import { clockTime } from '@/lib/shop-clock';
import { useSignInEnd } from '../hooks/use-sign-in-end';
import { SignInAgainDialog } from './sign-in-again-dialog';

const useStyles = makeStyles({
  // Stays in sight on a long page while its form is filled in.
  bar: {
    position: 'sticky',
    top: tokens.spacingVerticalS,
    zIndex: 1,
    marginBottom: tokens.spacingVerticalL,
    boxShadow: tokens.shadow8,
    '@media print': { display: 'none' },
  },
});

/**
 * Shown a few minutes before the office's sign-in ends for good (it is renewed only so long after the
 * password was given): when it ends, and a way to sign in again without leaving the page.
 */
export function SignInEndNotice({ user, timeZone }: { user: AuthUser; timeZone: string | undefined }) {
  const styles = useStyles();
  const notice = useSignInEnd();
  const [asking, setAsking] = useState(false);
  const endsAt = notice && clockTime(notice.endsAt, timeZone);
  return (
    <>
      {notice && (
        <MessageBar intent="info" layout="multiline" className={styles.bar}>
          <MessageBarBody>
            <MessageBarTitle>Your sign-in ends at {endsAt}</MessageBarTitle>
            It has run as long as one sign-in can. Sign in again now to carry on: this page stays as it is,
            with everything you have typed.
          </MessageBarBody>
          <MessageBarActions>
            <Button appearance="primary" onClick={() => setAsking(true)}>
              Sign in again now
            </Button>
          </MessageBarActions>
        </MessageBar>
      )}
      {asking && <SignInAgainDialog user={user} onClose={() => setAsking(false)} />}
    </>
  );
}
