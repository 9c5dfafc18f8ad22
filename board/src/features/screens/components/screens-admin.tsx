import { useState, type FormEvent } from 'react';
import {
  Body1,
  Button,
  Caption1,
  Card,
  Field,
  Input,
  Link,
  MessageBar,
  MessageBarBody,
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
import { createScreenSchema, type ScreenPairing } from '@baytime/shared';
import { paths } from '@/config/paths';
import { formErrorText, issuesToFieldErrors, type FieldErrors } from '@/lib/form-errors';
import { useCreateScreen } from '../api/create-screen';
import { useScreens } from '../api/get-screens';

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  card: {
    padding: tokens.spacingHorizontalXL,
    gap: tokens.spacingVerticalM,
    marginBottom: tokens.spacingVerticalXXL,
  },
  row: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalL, alignItems: 'flex-end' },
  name: { minWidth: '18rem' },
  code: {
    fontSize: 'clamp(3rem, 9vw, 6rem)',
    fontWeight: tokens.fontWeightBold,
    letterSpacing: '0.25em',
    fontVariantNumeric: 'tabular-nums',
    lineHeight: 1.1,
    padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalXL}`,
    borderRadius: tokens.borderRadiusXLarge,
    backgroundColor: tokens.colorNeutralBackground3,
    alignSelf: 'flex-start',
  },
  steps: {
    margin: 0,
    paddingLeft: '1.25rem',
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalXS,
  },
  dim: { color: tokens.colorNeutralForeground3 },
});

const when = new Intl.DateTimeFormat(undefined, { dateStyle: 'medium', timeStyle: 'short' });

function sinceText(iso: string | null): string {
  if (!iso) return '—';
  const minutes = Math.round((Date.now() - Date.parse(iso)) / 60_000);
  if (minutes < 2) return 'just now';
  if (minutes < 90) return `${minutes} min ago`;
  return when.format(new Date(iso));
}

function PairingCode({ pairing, name }: { pairing: ScreenPairing; name: string }) {
  const styles = useStyles();
  const origin = window.location.origin;
  const direct = `${origin}${paths.wall}?code=${pairing.code}`;
  return (
    <>
      <Body1>
        Pairing code for <strong>{name}</strong>:
      </Body1>
      <div className={styles.code} aria-label={`Pairing code ${pairing.code.split('').join(' ')}`}>
        {pairing.code}
      </div>
      <ol className={styles.steps}>
        <li>
          On the TV, open <strong>{`${origin}${paths.wall}`}</strong> and type the code, or open{' '}
          <Link href={direct}>{direct}</Link>.
        </li>
        <li>The code works once and expires at {when.format(new Date(pairing.expiresAt))}.</li>
      </ol>
    </>
  );
}

export function CreateScreenCard() {
  const styles = useStyles();
  const create = useCreateScreen();
  const [name, setName] = useState('');
  const [errors, setErrors] = useState<FieldErrors>({});
  const [made, setMade] = useState<{ pairing: ScreenPairing; name: string } | null>(null);

  const submit = (event: FormEvent) => {
    event.preventDefault();
    const parsed = createScreenSchema.safeParse({ name });
    if (!parsed.success) return setErrors(issuesToFieldErrors(parsed.error.issues));
    setErrors({});
    create.mutate(parsed.data, {
      onSuccess: (pairing) => {
        setMade({ pairing, name: parsed.data.name });
        setName('');
      },
    });
  };

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">Pair a wall screen</Subtitle2>
      <form className={styles.row} onSubmit={submit} noValidate>
        <Field
          label="Screen name"
          required
          validationMessage={errors.name}
          className={styles.name}
          hint="Where it hangs, e.g. “Shop floor, north wall”"
        >
          <Input value={name} maxLength={60} onChange={(_, data) => setName(data.value)} />
        </Field>
        <Button appearance="primary" type="submit" disabled={create.isPending}>
          {create.isPending ? 'Making a code…' : 'Make a pairing code'}
        </Button>
      </form>
      {create.isError && (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(create.error)}</MessageBarBody>
        </MessageBar>
      )}
      {made && <PairingCode pairing={made.pairing} name={made.name} />}
    </Card>
  );
}

export function ScreensTable() {
  const styles = useStyles();
  const screens = useScreens();
  if (screens.isPending) return <Spinner label="Loading screens…" />;
  if (screens.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(screens.error)}</MessageBarBody>
      </MessageBar>
    );
  if (screens.data.length === 0) return <Body1 className={styles.dim}>No wall screens yet.</Body1>;
  return (
    <Table aria-label="Wall screens" className={styles.table}>
      <TableHeader>
        <TableRow>
          <TableHeaderCell>Screen</TableHeaderCell>
          <TableHeaderCell>Paired</TableHeaderCell>
          <TableHeaderCell>Last seen</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {screens.data.map((screen) => (
          <TableRow key={screen.id}>
            <TableCell>{screen.name}</TableCell>
            <TableCell>
              {screen.pairedAt ? (
                when.format(new Date(screen.pairedAt))
              ) : (
                <Caption1>Waiting for its code</Caption1>
              )}
            </TableCell>
            <TableCell>{sinceText(screen.lastSeenAt)}</TableCell>
          </TableRow>
        ))}
      </TableBody>
    </Table>
  );
}
