import { BackspaceIcon } from './icons';
import './keypad.css';

export interface KeypadProps {
  onDigit: (digit: string) => void;
  onBackspace: () => void;
  onClear: () => void;
  /** A key that flips the sign, for temperatures below zero. */
  onMinus?: () => void;
  /** A decimal point key. */
  onPoint?: () => void;
  disabled?: boolean;
  label?: string;
}

const DIGITS = ['1', '2', '3', '4', '5', '6', '7', '8', '9'] as const;

function buzz() {
  navigator.vibrate?.(8);
}

/**
 * A numeric keypad with keys well over 20 mm, spaced for gloved fingers. With a minus or point key
 * it grows a row: − 0 . over Clear and Delete.
 */
export function Keypad({ onDigit, onBackspace, onClear, onMinus, onPoint, disabled, label }: KeypadProps) {
  const press = (action: () => void) => () => {
    buzz();
    action();
  };
  const extended = onMinus !== undefined || onPoint !== undefined;
  const clearKey = (
    <button type="button" className="bt-key bt-key--word" disabled={disabled} onClick={press(onClear)}>
      Clear
    </button>
  );
  const zeroKey = (
    <button type="button" className="bt-key" disabled={disabled} onClick={press(() => onDigit('0'))}>
      0
    </button>
  );
  const backKey = (
    <button
      type="button"
      className={`bt-key bt-key--word${extended ? ' bt-key--wide' : ''}`}
      disabled={disabled}
      onClick={press(onBackspace)}
      aria-label="Delete last digit"
    >
      <BackspaceIcon />
    </button>
  );

  return (
    <div
      className={`bt-keypad${extended ? ' bt-keypad--extended' : ''}`}
      role="group"
      aria-label={label ?? 'Keypad'}
    >
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
      {extended ? (
        <>
          <button
            type="button"
            className="bt-key"
            disabled={disabled || !onMinus}
            onClick={onMinus && press(onMinus)}
            aria-label="Minus: below zero"
          >
            −
          </button>
          {zeroKey}
          <button
            type="button"
            className="bt-key"
            disabled={disabled || !onPoint}
            onClick={onPoint && press(onPoint)}
            aria-label="Decimal point"
          >
            .
          </button>
          {clearKey}
          {backKey}
        </>
      ) : (
        <>
          {clearKey}
          {zeroKey}
          {backKey}
        </>
      )}
    </div>
  );
}
