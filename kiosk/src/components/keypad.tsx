import { useEffect, useEffectEvent } from 'react';
import { BackspaceIcon } from './icons';
import './keypad.css';

export interface KeypadKeys {
  onDigit: (digit: string) => void;
  onBackspace: () => void;
  onClear: () => void;
  /** A key that flips the sign, for temperatures below zero. */
  onMinus?: () => void;
  /** A decimal point key. */
  onPoint?: () => void;
}

export interface KeypadProps extends KeypadKeys {
  disabled?: boolean;
  label?: string;
}

export interface HardwareKeys extends KeypadKeys {
  onEnter: () => void;
  /** Escape, where it does not already close a sheet. */
  onEscape?: () => void;
}

/**
 * A USB keyboard or a badge reader types on the keypad too: digits, Backspace, Delete (clears),
 * the point and minus where the keypad has them, and Enter. Enter on a focused button that is not
 * a key stays that button's own, so Tab to Cancel and Enter cancels.
 */
export function useHardwareKeys(keys: HardwareKeys, enabled = true) {
  const handle = useEffectEvent((event: KeyboardEvent) => {
    if (event.metaKey || event.ctrlKey || event.altKey) return;
    const target = event.target instanceof Element ? event.target : null;
    if (target?.closest('input, textarea, select, [contenteditable]')) return;
    const { key } = event;
    if (/^[0-9]$/.test(key)) keys.onDigit(key);
    else if (key === 'Backspace') keys.onBackspace();
    else if (key === 'Delete') keys.onClear();
    else if ((key === '.' || key === ',') && keys.onPoint) keys.onPoint();
    else if (key === '-' && keys.onMinus) keys.onMinus();
    else if (key === 'Escape' && keys.onEscape) keys.onEscape();
    else if (key === 'Enter' && !target?.closest('button:not(.bt-key), a[href]')) keys.onEnter();
    else return;
    event.preventDefault();
  });
  useEffect(() => {
    if (!enabled) return;
    const listener = (event: KeyboardEvent) => handle(event);
    window.addEventListener('keydown', listener);
    return () => window.removeEventListener('keydown', listener);
  }, [enabled]);
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
