import { Combobox, Input, Option, makeStyles, tokens } from '@fluentui/react-components';
import { formatBookHours, skillWords, type OperationDto } from '@baytime/shared';
import { matchOperations } from '../intake-form';

const useStyles = makeStyles({
  option: { display: 'flex', justifyContent: 'space-between', gap: tokens.spacingHorizontalL, width: '100%' },
  hours: { color: tokens.colorNeutralForeground3, fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
});

export interface OperationPickerProps {
  id?: string;
  value: string;
  operations: readonly OperationDto[];
  autoFocus?: boolean;
  onTitle: (title: string) => void;
  onPick: (operation: OperationDto) => void;
}

/** A job line's title: picked from the shop's menu (which fills the book hours) or typed freely. */
export function OperationPicker({ id, value, operations, autoFocus, onTitle, onPick }: OperationPickerProps) {
  const styles = useStyles();
  if (operations.length === 0)
    return (
      <Input
        id={id}
        value={value}
        autoFocus={autoFocus}
        placeholder="What to do, e.g. Replace front brake pads"
        onChange={(_, data) => onTitle(data.value)}
      />
    );
  const matches = matchOperations(operations, value);
  return (
    <Combobox
      id={id}
      freeform
      autoFocus={autoFocus}
      value={value}
      selectedOptions={[]}
      placeholder="Search the menu or type the job"
      onChange={(event) => onTitle(event.target.value)}
      onOptionSelect={(_, data) => {
        const operation = operations.find((op) => String(op.id) === data.optionValue);
        if (operation) onPick(operation);
      }}
    >
      {matches.map((operation) => (
        <Option key={operation.id} value={String(operation.id)} text={operation.title}>
          <span className={styles.option}>
            <span>{operation.title}</span>
            <span className={styles.hours}>
              {formatBookHours(operation.defaultBookHours)} · {skillWords(operation.skillLevel)}
            </span>
          </span>
        </Option>
      ))}
      {matches.length === 0 && (
        <Option disabled value="none" text="">
          Not on the menu: the typed title is used
        </Option>
      )}
    </Combobox>
  );
}
