import { useState, type FormEvent } from 'react';
import { FormErrorBar } from '@/components/form-error-bar';
import { useCheckedSubmit } from '@/hooks/use-checked-submit';
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
  const [name, setName] = useState('');
  const [kind, setKind] = useState<BayKind>('two-post');
  const { errors, formError, submit: check } = useCheckedSubmit(createBaySchema, create);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    check({ name, kind }, () => setName(''));
  };

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Add a bay</Subtitle2>
      <form className={styles.row} onSubmit={submit} noValidate>
        <Field
          label="Name"
          required
          validationMessage={errors.name}
          className={styles.name}
          hint="Short: it is the headline on the wall"
        >
          <Input value={name} maxLength={24} onChange={(_, data) => setName(data.value)} />
        </Field>
        <Field label="Kind">
          <Select value={kind} onChange={(_, data) => setKind(data.value as BayKind)}>
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
      <FormErrorBar message={formError} />
    </Card>
  );
}

function BayRow({
  bay,
  order,
  onError,
}: {
  bay: BayDto;
  order: number;
  onError: (message: string | null) => void;
}) {
  const styles = useStyles();
  const update = useUpdateBay();
  const [editing, setEditing] = useState(false);
  const [name, setName] = useState(bay.name);
  const [nameError, setNameError] = useState<string | undefined>();

  const rename = (event: FormEvent) => {
    event.preventDefault();
    const parsed = updateBaySchema.safeParse({ name });
    if (!parsed.success) return setNameError(parsed.error.issues[0]?.message);
    setNameError(undefined);
    onError(null);
    update.mutate(
      { id: bay.id, ...parsed.data },
      {
        onSuccess: () => setEditing(false),
        onError: (error) => onError(`${bay.name}: ${formErrorText(error)}`),
      },
    );
  };

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
      <TableCell>
        {editing ? (
          <form className={styles.inline} onSubmit={rename} noValidate>
            <Field validationMessage={nameError} aria-label={`New name for ${bay.name}`}>
              <Input value={name} maxLength={24} autoFocus onChange={(_, data) => setName(data.value)} />
            </Field>
            <Button type="submit" appearance="primary" disabled={update.isPending}>
              Save
            </Button>
            <Button
              onClick={() => {
                setEditing(false);
                setName(bay.name);
                setNameError(undefined);
              }}
            >
              Cancel
            </Button>
          </form>
        ) : (
          bay.name
        )}
      </TableCell>
      <TableCell>{BAY_KIND_LABELS[bay.kind] ?? bay.kind}</TableCell>
      <TableCell>
        <Badge appearance="tint" color={bay.active ? 'success' : 'subtle'}>
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
        </div>
      </TableCell>
    </TableRow>
  );
}

export function BaysTable() {
  const styles = useStyles();
  const bays = useBays();
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
            <BayRow key={bay.id} bay={bay} order={index + 1} onError={setError} />
          ))}
        </TableBody>
      </Table>
    </>
  );
}
