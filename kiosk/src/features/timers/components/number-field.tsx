import { useEffect, useRef, type ReactNode } from 'react';
import { Keypad, useHardwareKeys, type KeypadKeys } from '@/components/keypad';
import type { EntryKey, EntryRules } from '../temperature-entry';

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
  const field = useRef<HTMLButtonElement>(null);
  // On a short screen the sheet scrolls: what the keypad types stays in sight.
  useEffect(() => {
    if (active) field.current?.scrollIntoView({ block: 'nearest' });
  }, [active, text]);
  return (
    <button
      ref={field}
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

/**
 * The keypad under an entry: minus and point keys where the rules allow them. A keyboard or a badge
 * reader types on it too, and Enter sends.
 */
export function EntryKeypad({
  apply,
  rules,
  onEnter,
  disabled,
}: {
  apply: (key: EntryKey) => void;
  rules: EntryRules;
  onEnter: () => void;
  disabled: boolean;
}) {
  const keys: KeypadKeys = {
    onDigit: (digit) => apply(digit as EntryKey),
    onBackspace: () => apply('back'),
    onClear: () => apply('clear'),
    onMinus: rules.minus ? () => apply('-') : undefined,
    onPoint: rules.decimals > 0 ? () => apply('.') : undefined,
  };
  useHardwareKeys({ ...keys, onEnter }, !disabled);
  return <Keypad {...keys} disabled={disabled} label="Number keypad" />;
}

/** Under an entry, in the sheet's footer so it stays in view: what is wrong, and the button under the keypad. */
export function EntrySend({
  problem,
  busy,
  onSend,
  children,
}: {
  problem: string;
  busy: boolean;
  onSend: () => void;
  children: ReactNode;
}) {
  return (
    <div className="bt-entry bt-entry--send">
      <p className="bt-entry__problem" role="alert">
        {problem}
      </p>
      <button type="button" className="bt-action bt-action--go bt-entry__go" onClick={onSend} disabled={busy}>
        {children}
      </button>
    </div>
  );
}
