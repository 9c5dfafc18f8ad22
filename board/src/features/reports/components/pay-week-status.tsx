import { useState } from 'react';
import { Link } from 'react-router';
import {
  Button,
  MessageBar,
  MessageBarActions,
  MessageBarBody,
  MessageBarTitle,
  Text,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { PayReport } from '@baytime/shared';
import { FormErrorBar } from '@/components/form-error-bar';
import { ReasonDialog } from '@/components/reason-dialog';
import { paths } from '@/config/paths';
import { useMinuteNow } from '@/hooks/use-minute-now';
import { formErrorText } from '@/lib/form-errors';
import { useClosePayWeek } from '../api/close-pay-week';
import { useReopenPayWeek } from '../api/reopen-pay-week';

const useStyles = makeStyles({
  row: { display: 'flex', flexWrap: 'wrap', alignItems: 'center', gap: tokens.spacingHorizontalM },
  dim: { color: tokens.colorNeutralForeground2 },
});

const when = (iso: string, timeZone: string) =>
  new Intl.DateTimeFormat('en-US', { dateStyle: 'medium', timeStyle: 'short', timeZone }).format(
    new Date(iso),
  );

/** Whether the week is closed for pay, what still stops it closing, and the owner's close and reopen. */
export function PayWeekStatus({ report }: { report: PayReport }) {
  const styles = useStyles();
  const close = useClosePayWeek();
  const reopen = useReopenPayWeek();
  const [reopening, setReopening] = useState(false);
  const running = Date.parse(report.to) > useMinuteNow();
  const exceptionsLink = `${paths.exceptions}?week=${encodeURIComponent(report.week)}`;

  const reopenDialog = (
    <ReasonDialog
      open={reopening}
      title={`Reopen the ${report.weekName.replace(/^Week/, 'week')}`}
      confirm="Reopen the week"
      pending={reopen.isPending}
      error={reopen.isError ? formErrorText(reopen.error) : null}
      onConfirm={(reason) =>
        reopen.mutate({ week: report.week, reason }, { onSuccess: () => setReopening(false) })
      }
      onClose={() => setReopening(false)}
    >
      Punches and corrections dated in it are accepted again until it is closed once more. The figures it was
      closed with stay what payroll was given: closed again, it pays only the difference, as an adjustment in
      the next open pay week.
    </ReasonDialog>
  );

  // The dialog stays mounted across the switch from closed to open (see ReasonDialog).
  const state = report.closed ? (
    <MessageBar intent="info" layout="multiline">
      <MessageBarBody>
        <MessageBarTitle>Closed for pay</MessageBarTitle>
        {report.closedAt && `On ${when(report.closedAt, report.timeZone)}`}
        {report.closedBy && ` by ${report.closedBy}`}
        {report.firstClosedAt &&
          `, again: it was first closed on ${when(report.firstClosedAt, report.timeZone)}, and those figures stay`}
        . These are the figures saved then: nothing dated in this week can change, and a change since shows as
        an adjustment in the next open week.
      </MessageBarBody>
      <MessageBarActions>
        <Button
          onClick={() => {
            reopen.reset();
            setReopening(true);
          }}
        >
          Reopen…
        </Button>
      </MessageBarActions>
    </MessageBar>
  ) : (
    <>
      {report.firstClosedAt && (
        <MessageBar intent="info" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Reopened</MessageBarTitle>
            First closed on {when(report.firstClosedAt, report.timeZone)}: payroll was given those figures.
            These are worked out again from the records; closing the week again keeps the first figures and
            pays the difference as an adjustment in the next open week.
          </MessageBarBody>
        </MessageBar>
      )}
      {report.unresolvedExceptions > 0 && (
        <MessageBar intent="warning" layout="multiline">
          <MessageBarBody>
            <MessageBarTitle>Not final</MessageBarTitle>
            {report.unresolvedExceptions === 1
              ? '1 exception in this week still waits for the foreman. '
              : `${report.unresolvedExceptions} exceptions in this week still wait for the foreman. `}
            <Link to={exceptionsLink}>Open the exceptions list</Link>
          </MessageBarBody>
        </MessageBar>
      )}
      <div className={styles.row}>
        <Text className={styles.dim}>
          {running
            ? 'This week is still running: it can be closed for pay once it is over.'
            : report.unresolvedExceptions > 0
              ? 'Resolve the exceptions, then close the week for pay.'
              : 'Open. Closing keeps these figures and the rates used; nothing dated in the week can change after.'}
        </Text>
        <Button
          appearance="primary"
          disabled={running || report.unresolvedExceptions > 0 || close.isPending}
          onClick={() => close.mutate(report.week)}
        >
          {close.isPending ? 'Closing…' : 'Close this pay week'}
        </Button>
      </div>
      <FormErrorBar message={close.isError ? formErrorText(close.error) : null} />
    </>
  );
  return (
    <>
      {state}
      {reopenDialog}
    </>
  );
}
