import '@fontsource/barlow/400.css';
import '@fontsource/barlow/500.css';
import '@fontsource/barlow/600.css';
import '@fontsource/barlow/700.css';
import '@fontsource/barlow-semi-condensed/600.css';
import '@fontsource/barlow-semi-condensed/700.css';
import { useSyncExternalStore, type ReactNode } from 'react';
import { Outlet, isRouteErrorResponse, useRouteError } from 'react-router';
import {
  Button,
  FluentProvider,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { baytimeDarkTheme, baytimeLightTheme } from '@/lib/theme';

const darkQuery =
  typeof window !== 'undefined' ? window.matchMedia('(prefers-color-scheme: dark)') : undefined;
const subscribeScheme = (listener: () => void) => {
  darkQuery?.addEventListener('change', listener);
  return () => darkQuery?.removeEventListener('change', listener);
};
const prefersDark = () => darkQuery?.matches ?? false;

const useStyles = makeStyles({
  root: {
    minHeight: '100vh',
    backgroundColor: tokens.colorNeutralBackground2,
    color: tokens.colorNeutralForeground1,
  },
  error: { maxWidth: '40rem', margin: '0 auto', padding: tokens.spacingVerticalXXXL },
});

function OfficeTheme({ children }: { children: ReactNode }) {
  const dark = useSyncExternalStore(subscribeScheme, prefersDark, () => false);
  const styles = useStyles();
  return (
    <FluentProvider theme={dark ? baytimeDarkTheme : baytimeLightTheme}>
      {/* Layout lives on a div: Fluent copies the provider's class onto every popover's mount node. */}
      <div className={styles.root}>{children}</div>
    </FluentProvider>
  );
}

/** The office branch: Fluent UI with Baytime's theme, in light or dark as the computer prefers. */
export function Component() {
  return (
    <OfficeTheme>
      <Outlet />
    </OfficeTheme>
  );
}

export function ErrorBoundary() {
  const error = useRouteError();
  const styles = useStyles();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <OfficeTheme>
      <div className={styles.error}>
        <MessageBar intent="error" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>This page could not be shown</MessageBarTitle>
            {message}
          </MessageBarBody>
        </MessageBar>
        <p>
          <Button appearance="primary" onClick={() => window.location.reload()}>
            Load the page again
          </Button>
        </p>
      </div>
    </OfficeTheme>
  );
}
