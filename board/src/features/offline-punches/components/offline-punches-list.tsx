import { useState } from 'react';
import {
  Badge,
  Body1,
  Button,
  Caption1,
  MessageBar,
  MessageBarBody,
  Select,
  Field,
  Spinner,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import { OFFLINE_PUNCH_STATUSES, type OfflinePunchDto, type OfflinePunchStatus } from '@baytime/shared';
import { dayClockTime } from '@/lib/shop-clock';
import { formErrorText } from '@/lib/form-errors';
import { useDecideOfflinePunch } from '../api/decide-offline-punch';
import { useOfflinePunches } from '../api/get-offline-punches';
import { STATUS_WORDS, punchWords, whoWords } from '../offline-punch-words';

const useStyles = makeStyles({
  filter: { maxWidth: '20rem', marginBottom: tokens.spacingVerticalL },
  table: { tableLayout: 'auto' },
  dim: { color: tokens.colorNeutralForeground3 },
  actions: { display: 'flex', gap: tokens.spacingHorizontalS, justifyContent: 'flex-end' },
});

const STATUS_BADGE: Record<OfflinePunchStatus, 'important' | 'danger' | 'brand' | 'subtle'> = {
  unverified: 'important',
  refused: 'danger',
  confirmed: 'brand',
  rejected: 'subtle',
};

/**
 * Punches recorded at a kiosk while it could not reach the server. They count only once confirmed: at
 * the technician's next sign-in online, or here by the foreman (a refused one too, when the foreman
 * knows the technician was there).
 */
export function OfflinePunchesList({ timeZone }: { timeZone: string | undefined }) {
  const styles = useStyles();
  const [status, setStatus] = useState<OfflinePunchStatus | null>(null);
  const punches = useOfflinePunches(status);
  const decide = useDecideOfflinePunch();
  const when = { format: (at: Date) => dayClockTime(at, timeZone) };

  return (
    <>
      <Field label="Show" className={styles.filter}>
        <Select
          value={status ?? ''}
          onChange={(_, data) => setStatus((data.value || null) as OfflinePunchStatus | null)}
        >
          <option value="">All offline punches</option>
          {OFFLINE_PUNCH_STATUSES.map((s) => (
            <option key={s} value={s}>
              {STATUS_WORDS[s]}
            </option>
          ))}
        </Select>
      </Field>
      {decide.isError && (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(decide.error)}</MessageBarBody>
        </MessageBar>
      )}
      {punches.isPending ? (
        <Spinner label="Loading offline punches…" />
      ) : punches.isError ? (
        <MessageBar intent="error">
          <MessageBarBody>{formErrorText(punches.error)}</MessageBarBody>
        </MessageBar>
      ) : punches.data.items.length === 0 ? (
        <Body1 className={styles.dim}>No punches recorded offline.</Body1>
      ) : (
        <Table aria-label="Offline punches" className={styles.table}>
          <TableHeader>
            <TableRow>
              <TableHeaderCell>Tapped</TableHeaderCell>
              <TableHeaderCell>Technician</TableHeaderCell>
              <TableHeaderCell>Punch</TableHeaderCell>
              <TableHeaderCell>Kiosk</TableHeaderCell>
              <TableHeaderCell>Status</TableHeaderCell>
              <TableHeaderCell>
                <span className="visually-hidden">Actions</span>
              </TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {punches.data.items.map((punch) => (
              <Row
                key={punch.id}
                punch={punch}
                when={when}
                onDecide={(decision) => decide.mutate({ id: punch.id, decision })}
                busy={decide.isPending}
              />
            ))}
          </TableBody>
        </Table>
      )}
    </>
  );
}

function Row({
  punch,
  when,
  busy,
  onDecide,
}: {
  punch: OfflinePunchDto;
  when: { format: (at: Date) => string };
  busy: boolean;
  onDecide: (decision: 'confirm' | 'reject') => void;
}) {
  const styles = useStyles();
  const open = punch.status === 'unverified' || punch.status === 'refused';
  const label = `${punchWords(punch)} of ${whoWords(punch)} at ${when.format(new Date(punch.at))}`;
  return (
    <TableRow>
      <TableCell>{when.format(new Date(punch.at))}</TableCell>
      <TableCell>{whoWords(punch)}</TableCell>
      <TableCell>{punchWords(punch)}</TableCell>
      <TableCell>{punch.kioskName}</TableCell>
      <TableCell>
        <Badge appearance="tint" color={STATUS_BADGE[punch.status]}>
          {STATUS_WORDS[punch.status]}
        </Badge>
        {punch.problem && <Caption1 className={styles.dim}> {punch.problem}</Caption1>}
      </TableCell>
      <TableCell>
        {open && (
          <div className={styles.actions}>
            {punch.technicianId !== null && (
              <Button
                size="small"
                disabled={busy}
                onClick={() => onDecide('confirm')}
                aria-label={`Confirm ${label}`}
              >
                Confirm
              </Button>
            )}
            <Button
              size="small"
              disabled={busy}
              onClick={() => onDecide('reject')}
              aria-label={`Reject ${label}`}
            >
              Reject
            </Button>
          </div>
        )}
      </TableCell>
    </TableRow>
  );
}
