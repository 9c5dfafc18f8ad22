import { Checkbox, Label, Text, makeStyles, tokens } from '@fluentui/react-components';
import { useId } from 'react';

const useStyles = makeStyles({
  group: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXXS },
  error: { color: tokens.colorPaletteRedForeground1 },
});

/**
 * A labelled set of checkboxes over a fixed list of codes: each shows its words and its code (the
 * code is what the other system reads), and the set's error below.
 */
export function CheckboxGroup<Code extends string>({
  label,
  codes,
  words,
  checked,
  onChange,
  error,
}: {
  label: string;
  codes: readonly Code[];
  words: Readonly<Record<Code, string>>;
  checked: readonly Code[];
  onChange: (checked: Code[]) => void;
  error: string | undefined;
}) {
  const styles = useStyles();
  const labelId = useId();
  return (
    <div role="group" aria-labelledby={labelId} className={styles.group}>
      <Label id={labelId} required>
        {label}
      </Label>
      {codes.map((code) => (
        <Checkbox
          key={code}
          label={`${words[code]} (${code})`}
          checked={checked.includes(code)}
          onChange={(_, data) =>
            onChange(data.checked === true ? [...checked, code] : checked.filter((each) => each !== code))
          }
        />
      ))}
      {error && (
        <Text role="alert" className={styles.error}>
          {error}
        </Text>
      )}
    </div>
  );
}
