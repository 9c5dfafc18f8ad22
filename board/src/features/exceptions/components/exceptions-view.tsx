import { useState } from 'react';
import { dayClockTime } from '@/lib/shop-clock';
import { Link } from 'react-router';
import {
  Badge,
  Button,
  Caption1,
  MessageBar,
  MessageBarBody,
  Spinner,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  makeStyles,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import { EXCEPTION_TITLES, type TimeException } from '@baytime/shared';
import { ReasonDialog } from '@/components/reason-dialog';
import { paths } from '@/config/paths';
import { formErrorText } from '@/lib/form-errors';
import { useAcceptHeldPunch } from '../api/accept-held-punch';
import { useExceptions } from '../api/get-exceptions';
import { useRejectHeldPunch } from '../api/reject-held-punch';
import { useReviewException } from '../api/review-exception';
import { useSignOffLine } from '../api/sign-off-line';

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  table: { tableLayout: 'auto' },
  when: { whiteSpace: 'nowrap', verticalAlign: 'top' },
  what: { verticalAlign: 'top' },
  text: { display: 'block', color: tokens.colorNeutralForeground2 },
  actions: { display: 'flex', flexWrap: 'wrap', gap: tokens.spacingHorizontalS, verticalAlign: 'top' },
  resolved: { opacity: 0.75 },
  loading: { opacity: 0.6 },
});

type Action = 'accept' | 'reject' | 'sign-off' | 'review';

const ACTION_WORDS: Record<Action, { button: string; title: string; confirm: string; explain: string }> = {
  accept: {
    button: 'Accept…',
    title: 'Accept the late punch',
    confirm: 'Accept and count it',
    explain:
      'It counts from now on, together with the later punches of the same replay that wait behind it (reject any of those first if it is wrong). The punches they displace together are taken out of the count, each on record.',
  },
  reject: {
    button: 'Reject…',
    title: 'Reject the late punch',
    confirm: 'Reject it',
    explain: 'It stays on record and is never counted.',
  },
  'sign-off': {
    button: 'Sign off…',
    title: 'Sign off a line done without clocked time',
    confirm: 'Sign off',
    explain:
      'Its book hours are flagged from now on. If the work was done while the technician was clocked on nothing, add the clock-on and clock-off on the timecard too, so that time is not also paid as idle.',
  },
  review: {
    button: 'Mark reviewed…',
    title: 'Mark the exception reviewed',
    confirm: 'Mark reviewed',
    explain:
      'Use this when the timecard is right as it is; otherwise correct the timecard and it clears itself.',
  },
};

function actionsFor(exception: TimeException): Action[] {
  if (exception.resolution) return [];
  if (exception.kind === 'held-punch') return ['accept', 'reject'];
  if (exception.kind === 'done-unclocked') return ['sign-off'];
  return ['review'];
}

const clock = (iso: string, timeZone: string) => dayClockTime(iso, timeZone);

/** The week's exceptions, shop-wide: what to deal with before the pay figures are final. */
export function ExceptionsView({ week }: { week: string }) {
  const styles = useStyles();
  const list = useExceptions(week);
  const accept = useAcceptHeldPunch();
  const reject = useRejectHeldPunch();
  const signOff = useSignOffLine();
  const review = useReviewException();
  const [open, setOpen] = useState<{ action: Action; exception: TimeException } | null>(null);
  const [shown, setShown] = useState(false);
  const mutation = { accept, reject, 'sign-off': signOff, review }[open?.action ?? 'review'];
  const show = (action: Action, exception: TimeException) => {
    mutation.reset();
    setOpen({ action, exception });
    setShown(true);
  };

  if (list.isPending) return <Spinner label="Loading the exceptions…" />;
  if (list.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(list.error)}</MessageBarBody>
      </MessageBar>
    );
  const { exceptions, timeZone, unresolved } = list.data;

  const decide = (reason: string) => {
    if (!open) return;
    const done = { onSuccess: () => setShown(false) };
    const { exception } = open;
    if (open.action === 'accept') accept.mutate({ id: exception.punchId!, reason }, done);
    else if (open.action === 'reject') reject.mutate({ id: exception.punchId!, reason }, done);
    else if (open.action === 'sign-off') signOff.mutate({ id: exception.jobLineId!, reason }, done);
    else review.mutate({ key: exception.key, note: reason }, done);
  };

  return (
    <div
      className={mergeClasses(styles.stack, list.isPlaceholderData && styles.loading)}
      aria-busy={list.isFetching}
    >
      <MessageBar intent={unresolved ? 'warning' : 'success'}>
        <MessageBarBody>
          {unresolved
            ? `${unresolved} exception${unresolved === 1 ? '' : 's'} to resolve: until then the week’s pay figures are not final and the week cannot be closed.`
            : 'Nothing to resolve this week.'}
        </MessageBarBody>
      </MessageBar>
      {exceptions.length > 0 && (
        <Table className={styles.table} aria-label="Exceptions this week">
          <TableHeader>
            <TableRow>
              <TableHeaderCell>When</TableHeaderCell>
              <TableHeaderCell>Technician</TableHeaderCell>
              <TableHeaderCell>What</TableHeaderCell>
              <TableHeaderCell>Action</TableHeaderCell>
            </TableRow>
          </TableHeader>
          <TableBody>
            {exceptions.map((exception) => (
              <TableRow key={exception.key} className={exception.resolution ? styles.resolved : undefined}>
                <TableCell className={styles.when}>{clock(exception.at, timeZone)}</TableCell>
                <TableCell className={styles.what}>
                  <Link
                    to={`${paths.timecards}?technician=${exception.technicianId}&week=${encodeURIComponent(week)}`}
                  >
                    {exception.technicianName}
                  </Link>
                </TableCell>
                <TableCell className={styles.what}>
                  <Text weight="semibold">{EXCEPTION_TITLES[exception.kind]}</Text>{' '}
                  {exception.resolution ? (
                    <Badge appearance="tint" color="brand" size="small">
                      Resolved
                    </Badge>
                  ) : (
                    <Badge appearance="tint" color="danger" size="small">
                      To resolve
                    </Badge>
                  )}
                  <Caption1 className={styles.text}>{exception.text}</Caption1>
                  {exception.resolution && (
                    <Caption1 className={styles.text}>
                      {exception.resolution.note} · {exception.resolution.by},{' '}
                      {clock(exception.resolution.at, timeZone)}
                    </Caption1>
                  )}
                </TableCell>
                <TableCell>
                  <div className={styles.actions}>
                    {actionsFor(exception).map((action) => (
                      <Button key={action} size="small" onClick={() => show(action, exception)}>
                        {ACTION_WORDS[action].button}
                      </Button>
                    ))}
                  </div>
                </TableCell>
              </TableRow>
            ))}
          </TableBody>
        </Table>
      )}
      {open && (
        <ReasonDialog
          key={`${open.action}:${open.exception.key}`}
          open={shown}
          title={ACTION_WORDS[open.action].title}
          label={open.action === 'review' ? 'What was checked' : 'Reason'}
          confirm={ACTION_WORDS[open.action].confirm}
          pending={mutation.isPending}
          error={mutation.isError ? formErrorText(mutation.error) : null}
          onConfirm={decide}
          onClose={() => setShown(false)}
        >
          <Text>
            {open.exception.technicianName}: {open.exception.text}
          </Text>
          <Caption1>{ACTION_WORDS[open.action].explain}</Caption1>
        </ReasonDialog>
      )}
    </div>
  );
}
