import { useState } from 'react';
import { FormErrorBar } from '@/components/form-error-bar';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import {
  Badge,
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
import { BAY_KINDS, createBaySchema, updateBaySchema, type BayDto } from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useBays } from '../api/get-bays';
import { useCreateBay } from '../api/create-bay';
import { useUpdateBay } from '../api/update-bay';
import { useReorderBays } from '../api/reorder-bays';

type BayKind = (typeof BAY_KINDS)[number];

export const BAY_KIND_LABELS: Record<BayKind, string> = {
  'two-post': 'Two-post lift',
  'four-post': 'Four-post lift',
  alignment: 'Alignment rack',
  flat: 'Flat bay',
  pit: 'Pit',
};

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  name: { minWidth: '14rem' },
  inline: { display: 'flex', gap: tokens.spacingHorizontalS, alignItems: 'flex-start' },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS },
  error: { marginBottom: tokens.spacingVerticalM },
  retired: { color: tokens.colorNeutralForeground4 },
});

export function AddBayForm() {
  const styles = useStyles();
  const create = useCreateBay();
  const form = useSchemaForm(createBaySchema, { defaultValues: { name: '', kind: 'two-post' } });
  const { errors } = form.formState;
  const submit = form.handleSubmit((body) =>
    create.mutate(body, {
      onSuccess: () => form.reset({ name: '', kind: body.kind }),
      onError: (error) => showServerErrors(form, error),
    }),
  );

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Add a bay</Subtitle2>
      <form className={styles.row} onSubmit={(event) => void submit(event)} noValidate>
        <Field
          label="Name"
          required
          validationMessage={errors.name?.message}
          className={styles.name}
          hint="Short: it is the headline on the wall"
        >
          <Input maxLength={24} {...form.register('name')} />
        </Field>
        <Field label="Kind">
          <Select {...form.register('kind')}>
            {BAY_KINDS.map((value) => (
              <option key={value} value={value}>
                {BAY_KIND_LABELS[value]}
              </option>
            ))}
          </Select>
        </Field>
        <Button appearance="primary" type="submit" disabled={create.isPending}>
          {create.isPending ? 'Adding…' : 'Add bay'}
        </Button>
      </form>
      <FormErrorBar message={errors.root?.server?.message ?? null} />
    </Card>
  );
}

/** A new name for a bay, checked by the shared schema. */
function RenameForm({ bay, onDone }: { bay: BayDto; onDone: () => void }) {
  const styles = useStyles();
  const update = useUpdateBay();
  const form = useSchemaForm(updateBaySchema, { defaultValues: { name: bay.name } });
  const submit = form.handleSubmit((body) =>
    update.mutate(
      { id: bay.id, ...body },
      { onSuccess: onDone, onError: (error) => showServerErrors(form, error) },
    ),
  );
  const { errors } = form.formState;
  return (
    <form className={styles.inline} onSubmit={(event) => void submit(event)} noValidate>
      <Field
        validationMessage={errors.name?.message ?? errors.root?.server?.message}
        aria-label={`New name for ${bay.name}`}
      >
        <Input maxLength={24} autoFocus {...form.register('name')} />
      </Field>
      <Button type="submit" appearance="primary" disabled={update.isPending}>
        Save
      </Button>
      <Button onClick={onDone}>Cancel</Button>
    </form>
  );
}

function BayRow({
  bay,
  order,
  onError,
  onMove,
  moving,
  first,
  last,
}: {
  bay: BayDto;
  order: number;
  onError: (message: string | null) => void;
  onMove: (by: -1 | 1) => void;
  moving: boolean;
  first: boolean;
  last: boolean;
}) {
  const styles = useStyles();
  const update = useUpdateBay();
  const [editing, setEditing] = useState(false);

  const setActive = (active: boolean) => {
    onError(null);
    update.mutate(
      { id: bay.id, active },
      { onError: (error) => onError(`${bay.name}: ${formErrorText(error)}`) },
    );
  };

  return (
    <TableRow className={bay.active ? undefined : styles.retired}>
      <TableCell>{bay.active ? order : '—'}</TableCell>
      <TableCell>{editing ? <RenameForm bay={bay} onDone={() => setEditing(false)} /> : bay.name}</TableCell>
      <TableCell>{BAY_KIND_LABELS[bay.kind] ?? bay.kind}</TableCell>
      <TableCell>
        <Badge appearance="tint" color={bay.active ? 'brand' : 'subtle'}>
          {bay.active ? 'On the board' : 'Retired'}
        </Badge>
      </TableCell>
      <TableCell>
        <div className={styles.actions}>
          {!editing && (
            <Button size="small" onClick={() => setEditing(true)}>
              Rename
            </Button>
          )}
          <Button size="small" disabled={update.isPending} onClick={() => setActive(!bay.active)}>
            {bay.active ? 'Retire' : 'Restore'}
          </Button>
          {bay.active && (
            <>
              <Button
                size="small"
                appearance="subtle"
                aria-label={`Move ${bay.name} earlier on the wall`}
                disabled={first || moving}
                onClick={() => onMove(-1)}
              >
                ↑
              </Button>
              <Button
                size="small"
                appearance="subtle"
                aria-label={`Move ${bay.name} later on the wall`}
                disabled={last || moving}
                onClick={() => onMove(1)}
              >
                ↓
              </Button>
            </>
          )}
        </div>
      </TableCell>
    </TableRow>
  );
}

export function BaysTable() {
  const styles = useStyles();
  const bays = useBays();
  const reorder = useReorderBays();
  const [error, setError] = useState<string | null>(null);

  if (bays.isPending) return <Spinner label="Loading bays…" />;
  if (bays.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(bays.error)}</MessageBarBody>
      </MessageBar>
    );
  const sorted = [...bays.data].sort(
    (a, b) => Number(b.active) - Number(a.active) || a.position - b.position,
  );
  const active = sorted.filter((bay) => bay.active);
  // The wall shows the bays in this order, and open wall screens take the new one at once.
  const move = (index: number, by: -1 | 1) => {
    const ids = active.map((bay) => bay.id);
    [ids[index], ids[index + by]] = [ids[index + by]!, ids[index]!];
    setError(null);
    reorder.mutate(ids, { onError: (failed) => setError(formErrorText(failed)) });
  };
  return (
    <>
      {error && (
        <MessageBar intent="error" className={styles.error}>
          <MessageBarBody>{error}</MessageBarBody>
        </MessageBar>
      )}
      <Table aria-label="Bays" className={styles.table}>
        <TableHeader>
          <TableRow>
            <TableHeaderCell>#</TableHeaderCell>
            <TableHeaderCell>Name</TableHeaderCell>
            <TableHeaderCell>Kind</TableHeaderCell>
            <TableHeaderCell>Board</TableHeaderCell>
            <TableHeaderCell>
              <span className="visually-hidden">Actions</span>
            </TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {sorted.map((bay, index) => (
            <BayRow
              key={bay.id}
              bay={bay}
              order={index + 1}
              onError={setError}
              onMove={(by) => move(index, by)}
              moving={reorder.isPending}
              first={index === 0}
              last={index === active.length - 1}
            />
          ))}
        </TableBody>
      </Table>
    </>
  );
}
