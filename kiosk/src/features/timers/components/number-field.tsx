import { useEffect, useEffectEvent } from 'react';
import type { EntryKey } from '../temperature-entry';

export interface NumberFieldProps {
  label: string;
  hint?: string;
  text: string;
  unit: string;
  active: boolean;
  invalid?: boolean;
  placeholder?: string;
  onSelect: () => void;
}

/** A big read-out that the keypad types into; tapping it makes it the one the keypad fills. */
export function NumberField({
  label,
  hint,
  text,
  unit,
  active,
  invalid,
  placeholder,
  onSelect,
}: NumberFieldProps) {
  return (
    <button
      type="button"
      className={`bt-field${active ? ' is-active' : ''}${invalid ? ' is-invalid' : ''}`}
      onClick={onSelect}
      aria-pressed={active}
    >
      <span className="bt-field__label">{label}</span>
      <span className="bt-field__value" aria-live={active ? 'polite' : undefined}>
        {text ? (
          <>
            {text.replace('-', '−')}
            <small>{unit}</small>
          </>
        ) : (
          <span className="bt-field__placeholder">{placeholder ?? 'Type on the keypad'}</span>
        )}
      </span>
      {hint && <span className="bt-field__hint">{hint}</span>}
    </button>
  );
}

/** A keyboard or a badge reader types on the entry too: digits, point, minus, delete, Enter. */
export function useEntryKeys(onKey: (key: EntryKey) => void, onEnter: () => void, enabled = true) {
  const handle = useEffectEvent((event: KeyboardEvent) => {
    if (event.metaKey || event.ctrlKey || event.altKey) return;
    if (/^[0-9]$/.test(event.key)) onKey(event.key as EntryKey);
    else if (event.key === '.' || event.key === ',') onKey('.');
    else if (event.key === '-') onKey('-');
    else if (event.key === 'Backspace') onKey('back');
    else if (event.key === 'Delete') onKey('clear');
    else if (event.key === 'Enter') onEnter();
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
