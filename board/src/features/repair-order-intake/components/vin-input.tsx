import { useLayoutEffect, useRef } from 'react';
import { Input, makeStyles, tokens, type InputProps } from '@fluentui/react-components';
import { normalizeVin } from '@baytime/shared';

const useStyles = makeStyles({
  vin: { fontFamily: tokens.fontFamilyMonospace, letterSpacing: '0.08em' },
});

/**
 * A VIN field that upper-cases as it is typed and drops the spaces and dashes of a VIN pasted in
 * groups, without moving the caret.
 */
export function VinInput({
  value,
  onValueChange,
  ...rest
}: Omit<InputProps, 'onChange' | 'value'> & { value: string; onValueChange: (vin: string) => void }) {
  const styles = useStyles();
  const ref = useRef<HTMLInputElement>(null);
  const caret = useRef<[number, number] | null>(null);

  useLayoutEffect(() => {
    if (!caret.current || !ref.current || document.activeElement !== ref.current) return;
    ref.current.setSelectionRange(...caret.current);
    caret.current = null;
  }, [value]);

  return (
    <Input
      {...rest}
      ref={ref}
      value={value}
      input={{ className: styles.vin, spellCheck: false, autoCapitalize: 'characters' }}
      autoComplete="off"
      onChange={(event, data) => {
        // The caret keeps its place among the characters that stay.
        const at = (position: number | null) =>
          normalizeVin(data.value.slice(0, position ?? data.value.length)).length;
        caret.current = [at(event.target.selectionStart), at(event.target.selectionEnd)];
        onValueChange(normalizeVin(data.value));
      }}
    />
  );
}
