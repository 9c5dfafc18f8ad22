import { Component, type ReactNode } from 'react';
import { Button, Caption1 } from '@fluentui/react-components';

interface State {
  failed: boolean;
}

/**
 * Charts load as a separate file: if it cannot be fetched (dropped link, or a new version of the app
 * replaced it), the report's tables stay on screen and only the chart says so.
 */
export class ChartBoundary extends Component<{ children: ReactNode }, State> {
  state: State = { failed: false };

  static getDerivedStateFromError(): State {
    return { failed: true };
  }

  render() {
    if (!this.state.failed) return this.props.children;
    return (
      <Caption1 role="alert">
        The chart could not be loaded. The figures are in the tables.{' '}
        <Button size="small" appearance="transparent" onClick={() => window.location.reload()}>
          Load the page again
        </Button>
      </Caption1>
    );
  }
}
