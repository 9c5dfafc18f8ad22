import { Spinner } from '@fluentui/react-components';

/** Shown while a screen loads: never a blank page. */
export function Splash({ label = 'Loading…' }: { label?: string }) {
  return (
    <div className="bt-splash" role="status">
      <Spinner size="huge" label={label} labelPosition="below" />
    </div>
  );
}
