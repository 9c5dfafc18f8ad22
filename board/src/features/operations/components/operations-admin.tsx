import { useEffect, useState } from 'react';
import { FormErrorBar } from '@/components/form-error-bar';
import { showServerErrors, useSchemaForm } from '@/lib/form';
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
import { formErrorText } from '@/lib/form-errors';
import { useOperations } from '../api/get-operations';
import { useCreateOperation } from '../api/create-operation';
import { useUpdateOperation } from '../api/update-operation';

const SKILL_LEVELS = [1, 2, 3, 4, 5] as const;

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

/** Typed hours as a number when they read as one ("0x10" does not); the schema says what is wrong. */
const asHours = (value: unknown) => (typeof value === 'string' ? (parseDecimal(value) ?? value) : value);

function formatHours(hours: number): string {
  return `${hours.toFixed(1)} h`;
}

export function AddOperationForm() {
  const styles = useStyles();
  const create = useCreateOperation();
  const empty = { title: '', skillLevel: 1 };
  const form = useSchemaForm(operationInputSchema, { defaultValues: empty });
  const { errors } = form.formState;
  const submit = form.handleSubmit((body) =>
    create.mutate(body, {
      onSuccess: () => form.reset(empty),
      onError: (error) => showServerErrors(form, error),
    }),
  );

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Add an operation</Subtitle2>
      <form className={styles.row} onSubmit={(event) => void submit(event)} noValidate>
        <Field
          label="Title"
          required
          validationMessage={errors.title?.message}
          className={styles.title}
          hint="As the advisor picks it on a repair order"
        >
          <Input maxLength={120} {...form.register('title')} />
        </Field>
        <Field
          label="Default book hours"
          required
          validationMessage={errors.defaultBookHours?.message}
          className={styles.hours}
        >
          <Input
            className={styles.fill}
            inputMode="decimal"
            placeholder="1.5"
            {...form.register('defaultBookHours', { setValueAs: asHours })}
          />
        </Field>
        <Field label="Skill level (1–5)" validationMessage={errors.skillLevel?.message}>
          <Select {...form.register('skillLevel', { valueAsNumber: true })}>
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
      <FormErrorBar message={errors.root?.server?.message ?? null} />
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
  const form = useSchemaForm(updateOperationSchema, {
    defaultValues: { title: operation.title, defaultBookHours: operation.defaultBookHours },
  });
  const { errors } = form.formState;
  const cancel = () => {
    setEditing(false);
    form.reset();
  };
  const save = form.handleSubmit((body) => {
    onError(null);
    update.mutate(
      { id: operation.id, ...body },
      {
        onSuccess: () => setEditing(false),
        onError: (error) => {
          if (error instanceof ApiError && Object.keys(error.fieldErrors).length > 0)
            showServerErrors(form, error);
          else onError(`${operation.title}: ${formErrorText(error)}`);
        },
      },
    );
  });

  return (
    <TableRow>
      {editing ? (
        <TableCell colSpan={2}>
          <form className={styles.inline} onSubmit={(event) => void save(event)} noValidate>
            <Field
              validationMessage={errors.title?.message}
              aria-label={`New title for ${operation.title}`}
              className={styles.title}
            >
              <Input maxLength={120} autoFocus {...form.register('title')} />
            </Field>
            <Field
              validationMessage={errors.defaultBookHours?.message}
              aria-label={`Book hours for ${operation.title}`}
              className={styles.hours}
            >
              <Input
                className={styles.fill}
                inputMode="decimal"
                {...form.register('defaultBookHours', { setValueAs: asHours })}
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
