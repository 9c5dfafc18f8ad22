import { useState } from 'react';
import {
  Badge,
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
import { dateTimeFormat } from '@/lib/date-format';
import { formErrorText } from '@/lib/form-errors';
import { showServerErrors, useSchemaForm } from '@/lib/form';
import { ConfirmDialog } from '@/components/confirm-dialog';
import { FormErrorBar } from '@/components/form-error-bar';
import { useCreateScreen } from '../api/create-screen';
import { useScreens, type DeviceKind, type WallScreenDto } from '../api/get-screens';
import { useRevokeScreen } from '../api/revoke-screen';
import { STATUS_WORDS, agoText, screenStatus, sortScreens, type ScreenStatus } from '../screen-status';

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
  revoked: { color: tokens.colorNeutralForeground3 },
  actions: { textAlign: 'right', width: '8rem' },
});

/** Dates and times in the shop's time zone, as every other office page shows them. */
const whenFormat = (timeZone: string | undefined) =>
  dateTimeFormat(timeZone, { dateStyle: 'medium', timeStyle: 'short' });

/** What the page says of each kind of device. */
const WORDS = {
  wall: {
    pair: 'Pair a wall screen',
    nameLabel: 'Screen name',
    nameHint: 'Where it hangs, e.g. “Shop floor, north wall”',
    device: 'the TV',
    page: paths.wall,
    table: 'Wall screens',
    column: 'Screen',
    none: 'No wall screens yet.',
    revoked:
      'The screen stops showing the board at once and goes back to its pairing page. To use it again, make a new pairing code.',
    unpaired: 'Its pairing code stops working. To pair a screen later, make a new code.',
    revoke: 'Revoke screen',
  },
  kiosk: {
    pair: 'Pair a kiosk tablet',
    nameLabel: 'Kiosk name',
    nameHint: 'Where it stands, e.g. “By the time clock”',
    device: 'the tablet',
    page: paths.kiosk,
    table: 'Kiosks',
    column: 'Kiosk',
    none: 'No kiosks paired yet.',
    revoked:
      'The tablet goes back to its pairing page and can no longer send punches it holds. To use it again, make a new pairing code.',
    unpaired: 'Its pairing code stops working. To pair a tablet later, make a new code.',
    revoke: 'Revoke kiosk',
  },
} as const;

function PairingCode({
  pairing,
  name,
  kind,
  timeZone,
}: {
  pairing: ScreenPairing;
  name: string;
  kind: DeviceKind;
  timeZone: string | undefined;
}) {
  const styles = useStyles();
  const when = whenFormat(timeZone);
  const origin = window.location.origin;
  const page = `${origin}${WORDS[kind].page}`;
  const direct = `${page}?code=${pairing.code}`;
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
          On {WORDS[kind].device}, open <strong>{page}</strong> and type the code, or open{' '}
          <Link href={direct}>{direct}</Link>.
        </li>
        <li>The code works once and expires at {when.format(new Date(pairing.expiresAt))}.</li>
      </ol>
    </>
  );
}

export interface ScreensAdminProps {
  kind?: DeviceKind;
  /** The shop's time zone: every time on the page is shop time. */
  timeZone: string | undefined;
}

export function CreateScreenCard({ kind = 'wall', timeZone }: ScreensAdminProps) {
  const styles = useStyles();
  const words = WORDS[kind];
  const create = useCreateScreen(kind);
  const form = useSchemaForm(createScreenSchema, { defaultValues: { name: '' } });
  const { errors } = form.formState;
  const [made, setMade] = useState<{ pairing: ScreenPairing; name: string } | null>(null);
  const submit = form.handleSubmit((body) =>
    create.mutate(body, {
      onSuccess: (pairing) => {
        setMade({ pairing, name: body.name });
        form.reset();
      },
      onError: (error) => showServerErrors(form, error),
    }),
  );

  return (
    <Card className={styles.card}>
      <Subtitle2 as="h2">{words.pair}</Subtitle2>
      <form className={styles.row} onSubmit={(event) => void submit(event)} noValidate>
        <Field
          label={words.nameLabel}
          required
          validationMessage={errors.name?.message}
          className={styles.name}
          hint={words.nameHint}
        >
          <Input maxLength={60} {...form.register('name')} />
        </Field>
        <Button appearance="primary" type="submit" disabled={create.isPending}>
          {create.isPending ? 'Making a code…' : 'Make a pairing code'}
        </Button>
      </form>
      <FormErrorBar message={errors.root?.server?.message ?? null} />
      {made && <PairingCode pairing={made.pairing} name={made.name} kind={kind} timeZone={timeZone} />}
    </Card>
  );
}

function RevokeDialog({
  screen,
  kind,
  onClose,
}: {
  screen: WallScreenDto;
  kind: DeviceKind;
  onClose: () => void;
}) {
  const revoke = useRevokeScreen(kind);
  return (
    <ConfirmDialog
      title={`Revoke “${screen.name}”?`}
      confirmLabel={WORDS[kind].revoke}
      pendingLabel="Revoking…"
      pending={revoke.isPending}
      error={revoke.isError ? formErrorText(revoke.error) : null}
      onConfirm={() => revoke.mutate(screen.id, { onSuccess: onClose })}
      onClose={onClose}
    >
      {screen.pairedAt !== null ? WORDS[kind].revoked : WORDS[kind].unpaired}
    </ConfirmDialog>
  );
}

/** "3 since 7:02 AM (said 7:05 AM)", "None (said 7:05 AM)", or "Not reported yet". */
function queueText(queue: WallScreenDto['queue'], when: Intl.DateTimeFormat): string {
  if (!queue?.reportedAt) return 'Not reported yet';
  const said = `said ${when.format(new Date(queue.reportedAt))}`;
  if (queue.waiting === 0) return `None (${said})`;
  const since = queue.since ? ` since ${when.format(new Date(queue.since))}` : '';
  return `${queue.waiting}${since} (${said})`;
}

const STATUS_BADGE: Record<ScreenStatus, 'brand' | 'informative' | 'subtle' | 'danger'> = {
  paired: 'brand',
  waiting: 'informative',
  expired: 'subtle',
  revoked: 'danger',
};

export function ScreensTable({ kind = 'wall', timeZone }: ScreensAdminProps) {
  const styles = useStyles();
  const when = whenFormat(timeZone);
  const words = WORDS[kind];
  const screens = useScreens(kind);
  const [revoking, setRevoking] = useState<WallScreenDto | null>(null);
  if (screens.isPending) return <Spinner label="Loading screens…" />;
  if (screens.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(screens.error)}</MessageBarBody>
      </MessageBar>
    );
  if (screens.data.length === 0) return <Body1 className={styles.dim}>{words.none}</Body1>;
  // The list reloads every 15 s: its fetch time is "now" for the ages shown.
  const now = screens.dataUpdatedAt;
  return (
    <>
      <Table aria-label={words.table} className={styles.table}>
        <TableHeader>
          <TableRow>
            <TableHeaderCell>{words.column}</TableHeaderCell>
            <TableHeaderCell>Status</TableHeaderCell>
            <TableHeaderCell>Paired</TableHeaderCell>
            <TableHeaderCell>Last seen</TableHeaderCell>
            {kind === 'kiosk' && <TableHeaderCell>Punches waiting on it</TableHeaderCell>}
            <TableHeaderCell>
              <span className="visually-hidden">Actions</span>
            </TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {sortScreens(screens.data, now).map((screen) => {
            const status = screenStatus(screen, now);
            return (
              <TableRow key={screen.id} className={status === 'revoked' ? styles.revoked : undefined}>
                <TableCell>{screen.name}</TableCell>
                <TableCell>
                  <Badge appearance="tint" color={STATUS_BADGE[status]}>
                    {STATUS_WORDS[status]}
                  </Badge>
                  {status === 'revoked' && screen.revokedAt && (
                    <Caption1 className={styles.dim}> {when.format(new Date(screen.revokedAt))}</Caption1>
                  )}
                  {status === 'waiting' && screen.pairingExpiresAt && (
                    <Caption1 className={styles.dim}>
                      {' '}
                      until {when.format(new Date(screen.pairingExpiresAt))}
                    </Caption1>
                  )}
                </TableCell>
                <TableCell>{screen.pairedAt ? when.format(new Date(screen.pairedAt)) : '—'}</TableCell>
                <TableCell>
                  {screen.lastSeenAt ? (
                    <span title={when.format(new Date(screen.lastSeenAt))}>
                      {agoText(screen.lastSeenAt, now) ?? when.format(new Date(screen.lastSeenAt))}
                    </span>
                  ) : (
                    '—'
                  )}
                </TableCell>
                {kind === 'kiosk' && <TableCell>{queueText(screen.queue, when)}</TableCell>}
                <TableCell className={styles.actions}>
                  {status !== 'revoked' && (
                    <Button
                      size="small"
                      onClick={() => setRevoking(screen)}
                      aria-label={`Revoke ${screen.name}`}
                    >
                      Revoke…
                    </Button>
                  )}
                </TableCell>
              </TableRow>
            );
          })}
        </TableBody>
      </Table>
      {revoking && <RevokeDialog screen={revoking} kind={kind} onClose={() => setRevoking(null)} />}
    </>
  );
}
