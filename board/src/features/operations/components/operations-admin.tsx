import { useEffect, useState, type FormEvent } from 'react';
import { FormErrorBar } from '@/components/form-error-bar';
import { useCheckedSubmit } from '@/hooks/use-checked-submit';
import {
  Button,
  Card,
  Field,
  Input,
  MessageBar,
  MessageBarBody,
  Select,
  Spinner,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { ApiError } from '@baytime/shared/client';
import {
  operationInputSchema,
  parseDecimal,
  updateOperationSchema,
  type OperationDto,
} from '@baytime/shared';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { useOperations } from '../api/get-operations';
import { useCreateOperation } from '../api/create-operation';
import { useUpdateOperation } from '../api/update-operation';

const SKILL_LEVELS = [1, 2, 3, 4, 5] as const;
const HOURS_MESSAGE = 'Enter hours between 0 and 99, e.g. 1.5';

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  title: { minWidth: '20rem' },
  hours: { width: '10rem' },
  fill: { minWidth: 0, width: '100%' },
  inline: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'flex-start' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS },
  error: { marginBottom: tokens.spacingVerticalM },
  numeric: { fontVariantNumeric: 'tabular-nums' },
});

/** Typed hours to a number; `undefined` for blank or non-decimal text ("0x10") so the schema flags it. */
function parseHours(text: string): number | undefined {
  return parseDecimal(text) ?? undefined;
}

function withHoursMessage(errors: FieldErrors): FieldErrors {
  return errors.defaultBookHours ? { ...errors, defaultBookHours: HOURS_MESSAGE } : errors;
}

function formatHours(hours: number): string {
  return `${hours.toFixed(1)} h`;
}

export function AddOperationForm() {
  const styles = useStyles();
  const create = useCreateOperation();
  const [title, setTitle] = useState('');
  const [hours, setHours] = useState('');
  const [skillLevel, setSkillLevel] = useState(1);
  const {
    errors,
    formError,
    submit: check,
  } = useCheckedSubmit(operationInputSchema, create, withHoursMessage);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    check({ title, defaultBookHours: parseHours(hours), skillLevel }, () => {
      setTitle('');
      setHours('');
      setSkillLevel(1);
    });
  };

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Add an operation</Subtitle2>
      <form className={styles.row} onSubmit={submit} noValidate>
        <Field
          label="Title"
          required
          validationMessage={errors.title}
          className={styles.title}
          hint="As the advisor picks it on a repair order"
        >
          <Input value={title} maxLength={120} onChange={(_, data) => setTitle(data.value)} />
        </Field>
        <Field
          label="Default book hours"
          required
          validationMessage={errors.defaultBookHours}
          className={styles.hours}
        >
          <Input
            value={hours}
            className={styles.fill}
            inputMode="decimal"
            placeholder="1.5"
            onChange={(_, data) => setHours(data.value)}
          />
        </Field>
        <Field label="Skill level (1–5)" validationMessage={errors.skillLevel}>
          <Select value={String(skillLevel)} onChange={(_, data) => setSkillLevel(Number(data.value))}>
            {SKILL_LEVELS.map((level) => (
              <option key={level} value={level}>
                {level}
              </option>
            ))}
          </Select>
        </Field>
        <Button appearance="primary" type="submit" disabled={create.isPending}>
          {create.isPending ? 'Adding…' : 'Add operation'}
        </Button>
      </form>
      <FormErrorBar message={formError} />
    </Card>
  );
}

function RemoveButton({
  operation,
  onError,
}: {
  operation: OperationDto;
  onError: (message: string | null) => void;
}) {
  const update = useUpdateOperation();
  const [confirming, setConfirming] = useState(false);

  useEffect(() => {
    if (!confirming) return;
    const timer = setTimeout(() => setConfirming(false), 5000);
    return () => clearTimeout(timer);
  }, [confirming]);

  const remove = () => {
    onError(null);
    update.mutate(
      { id: operation.id, active: false },
      {
        onError: (error) => onError(`${operation.title}: ${formErrorText(error)}`),
        onSettled: () => setConfirming(false),
      },
    );
  };

  return confirming ? (
    <Button size="small" appearance="primary" disabled={update.isPending} onClick={remove}>
      Confirm: remove
    </Button>
  ) : (
    <Button size="small" onClick={() => setConfirming(true)}>
      Remove
    </Button>
  );
}

function OperationRow({
  operation,
  onError,
}: {
  operation: OperationDto;
  onError: (message: string | null) => void;
}) {
  const styles = useStyles();
  const update = useUpdateOperation();
  const [editing, setEditing] = useState(false);
  const [title, setTitle] = useState(operation.title);
  const [hours, setHours] = useState(String(operation.defaultBookHours));
  const [errors, setErrors] = useState<FieldErrors>({});

  const cancel = () => {
    setEditing(false);
    setTitle(operation.title);
    setHours(String(operation.defaultBookHours));
    setErrors({});
  };

  const save = (event: FormEvent) => {
    event.preventDefault();
    const parsed = updateOperationSchema.safeParse({ title, defaultBookHours: parseHours(hours) });
    if (!parsed.success) return setErrors(withHoursMessage(issuesToFieldErrors(parsed.error.issues)));
    setErrors({});
    onError(null);
    update.mutate(
      { id: operation.id, ...parsed.data },
      {
        onSuccess: () => setEditing(false),
        onError: (error) => {
          if (error instanceof ApiError && Object.keys(error.fieldErrors).length > 0)
            setErrors(error.fieldErrors);
          else onError(`${operation.title}: ${formErrorText(error)}`);
        },
      },
    );
  };

  return (
    <TableRow>
      {editing ? (
        <TableCell colSpan={2}>
          <form className={styles.inline} onSubmit={save} noValidate>
            <Field
              validationMessage={errors.title}
              aria-label={`New title for ${operation.title}`}
              className={styles.title}
            >
              <Input value={title} maxLength={120} autoFocus onChange={(_, data) => setTitle(data.value)} />
            </Field>
            <Field
              validationMessage={errors.defaultBookHours}
              aria-label={`Book hours for ${operation.title}`}
              className={styles.hours}
            >
              <Input
                value={hours}
                className={styles.fill}
                inputMode="decimal"
                onChange={(_, data) => setHours(data.value)}
              />
            </Field>
            <Button type="submit" appearance="primary" disabled={update.isPending}>
              Save
            </Button>
            <Button onClick={cancel}>Cancel</Button>
          </form>
        </TableCell>
      ) : (
        <>
          <TableCell>{operation.title}</TableCell>
          <TableCell className={styles.numeric}>{formatHours(operation.defaultBookHours)}</TableCell>
        </>
      )}
      <TableCell className={styles.numeric}>{operation.skillLevel}</TableCell>
      <TableCell>
        <div className={styles.actions}>
          {!editing && (
            <Button size="small" onClick={() => setEditing(true)}>
              Edit
            </Button>
          )}
          <RemoveButton operation={operation} onError={onError} />
        </div>
      </TableCell>
    </TableRow>
  );
}

export function OperationsTable() {
  const styles = useStyles();
  const operations = useOperations();
  const [error, setError] = useState<string | null>(null);

  if (operations.isPending) return <Spinner label="Loading operations…" />;
  if (operations.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(operations.error)}</MessageBarBody>
      </MessageBar>
    );
  const sorted = [...operations.data].sort((a, b) => a.title.localeCompare(b.title));
  return (
    <>
      {error && (
        <MessageBar intent="error" className={styles.error}>
          <MessageBarBody>{error}</MessageBarBody>
        </MessageBar>
      )}
      {sorted.length === 0 ? (
        <MessageBar>
          <MessageBarBody>No operations on the menu yet. Add the first one above.</MessageBarBody>
        </MessageBar>
      ) : (
        <Table aria-label="Operations menu" className={styles.table}>
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Title</TableHeaderCell>
              <TableHeaderCell>Book hours</TableHeaderCell>
              <TableHeaderCell>Skill level</TableHeaderCell>
              <TableHeaderCell>
                <span className="visually-hidden">Actions</span>
              </TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {sorted.map((operation) => (
              <OperationRow key={operation.id} operation={operation} onError={setError} />
            ))}
          </TableBody>
        </Table>
      )}
    </>
  );
}
