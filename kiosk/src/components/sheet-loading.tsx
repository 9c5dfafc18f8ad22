import { Spinner } from '@fluentui/react-components';
import './sheet.css';

/** Shown for the moment a sheet's code is still on its way. */
export function SheetLoading() {
  return (
    <div className="bt-sheet-backdrop" role="status">
      <Spinner size="huge" label="Opening…" labelPosition="below" />
    </div>
  );
}
