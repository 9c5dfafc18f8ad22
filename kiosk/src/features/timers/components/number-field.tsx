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
