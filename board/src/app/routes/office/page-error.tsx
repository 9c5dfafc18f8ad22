import { isRouteErrorResponse, useRouteError } from 'react-router';
import {
  Button,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  makeStyles,
  tokens,
} from '@fluentui/react-components';

const useStyles = makeStyles({
  root: { maxWidth: '40rem', display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalM },
});

/** A page that failed to render or load: the navigation stays, the rest of the office works. */
export function PageError() {
  const styles = useStyles();
  const error = useRouteError();
  const message = isRouteErrorResponse(error)
    ? `${error.status} ${error.statusText}`
    : error instanceof Error
      ? error.message
      : 'Unknown error';
  return (
    <div className={styles.root} role="alert">
      <MessageBar intent="error" layout="multiline">
        <MessageBarBody>
          <MessageBarTitle>This page could not be shown</MessageBarTitle>
          {message}
        </MessageBarBody>
      </MessageBar>
      <div>
        <Button appearance="primary" onClick={() => window.location.reload()}>
          Load the page again
        </Button>
      </div>
    </div>
  );
}
