import { BackspaceIcon } from '@/components/icons';
import './keypad.css';

export interface KeypadProps {
  onDigit: (digit: string) => void;
  onBackspace: () => void;
  onClear: () => void;
  disabled?: boolean;
}

const DIGITS = ['1', '2', '3', '4', '5', '6', '7', '8', '9'] as const;

function buzz() {
  navigator.vibrate?.(8);
}

/** A numeric keypad with keys well over 20 mm, spaced for gloved fingers. */
export function Keypad({ onDigit, onBackspace, onClear, disabled }: KeypadProps) {
  const press = (action: () => void) => () => {
    buzz();
    action();
  };
  return (
    <div className="bt-keypad" role="group" aria-label="Keypad">
      {DIGITS.map((d) => (
        <button
          key={d}
          type="button"
          className="bt-key"
          disabled={disabled}
          onClick={press(() => onDigit(d))}
        >
          {d}
        </button>
      ))}
      <button type="button" className="bt-key bt-key--word" disabled={disabled} onClick={press(onClear)}>
        Clear
      </button>
      <button type="button" className="bt-key" disabled={disabled} onClick={press(() => onDigit('0'))}>
        0
      </button>
      <button
        type="button"
        className="bt-key bt-key--word"
        disabled={disabled}
        onClick={press(onBackspace)}
        aria-label="Delete last digit"
      >
        <BackspaceIcon />
      </button>
    </div>
  );
}
