import { useMemo, useState } from 'react';
import {
  Button,
  Caption1,
  Card,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
  Spinner,
  Subtitle2,
  Text,
  makeStyles,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import type { TimecardPunch } from '@baytime/shared';
import { formErrorText } from '@/lib/form-errors';
import { useTimecard } from '../api/get-timecard';
import { formatHours } from '../timecard-format';
import { cardDays } from '../timecard-model';
import { AuditTrail } from './audit-trail';
import { CorrectionDialog, type CorrectionTarget } from './correction-dialog';
import { DayDetail } from './day-detail';
import { WeekGlance } from './week-glance';
import { WeekReview } from './week-review';

const useStyles = makeStyles({
  page: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
  loading: { opacity: 0.6, transitionProperty: 'opacity', transitionDuration: tokens.durationNormal },
  flags: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  flag: { fontSize: tokens.fontSizeBase400 },
  bar: {
    display: 'flex',
    flexWrap: 'wrap',
    alignItems: 'stretch',
    gap: tokens.spacingHorizontalM,
  },
  total: {
    padding: `${tokens.spacingVerticalM} ${tokens.spacingHorizontalL}`,
    minWidth: '8.5rem',
    gap: tokens.spacingVerticalXXS,
  },
  totalValue: {
    fontSize: tokens.fontSizeHero700,
    lineHeight: tokens.lineHeightHero700,
    fontWeight: tokens.fontWeightSemibold,
    fontVariantNumeric: 'tabular-nums',
  },
  totalLabel: { color: tokens.colorNeutralForeground2 },
  spacer: { flexGrow: 1 },
  actions: { display: 'flex', alignItems: 'flex-end', gap: tokens.spacingHorizontalM },
  panel: { padding: tokens.spacingHorizontalXL, gap: tokens.spacingVerticalL },
  days: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalXL },
  dim: { color: tokens.colorNeutralForeground3 },
});

function Total({ label, seconds, note }: { label: string; seconds: number; note?: string }) {
  const styles = useStyles();
  return (
    <Card className={styles.total} appearance="filled-alternative">
      <Caption1 className={styles.totalLabel}>{label}</Caption1>
      <span className={styles.totalValue}>{formatHours(seconds)}</span>
      {note && <Caption1 className={styles.dim}>{note}</Caption1>}
    </Card>
  );
}

/** One technician's workweek: flags first, totals, the week on a time axis, each day's punches, the audit. */
export function TimecardView({
  technicianId,
  week,
  canCorrect,
}: {
  technicianId: number;
  week: string;
  canCorrect: boolean;
}) {
  const styles = useStyles();
  const card = useTimecard(technicianId, week);
  const [target, setTarget] = useState<{ of: CorrectionTarget; n: number; shown: boolean } | null>(null);
  const openDialog = (of: CorrectionTarget) =>
    setTarget((current) => ({ of, n: (current?.n ?? 0) + 1, shown: true }));
  const closeDialog = () => setTarget((current) => current && { ...current, shown: false });
  const [savedNote, setSaved] = useState<{ for: string; text: string } | null>(null);
  const saved = savedNote?.for === `${technicianId}/${week}` ? savedNote.text : null;
  const days = useMemo(() => (card.data ? cardDays(card.data) : []), [card.data]);

  if (card.isPending) return <Spinner label="Loading the timecard…" />;
  if (card.isError)
    return (
      <MessageBar intent="error">
        <MessageBarBody>{formErrorText(card.error)}</MessageBarBody>
      </MessageBar>
    );

  const data = card.data;
  const { totals } = data;
  // A voiding row is no punch of its own: it shows on the punch it takes out.
  const shown = data.punches.filter((punch) => !punch.voids);
  const corrections = shown.filter((punch) => punch.reason !== null).length;
  const takenOut = data.punches.length - shown.length;
  const activeDays = days.filter((day) => day.active);
  // A week closed for pay takes no correction: the server would refuse it with 409 anyway.
  const editable = canCorrect && !data.closed;
  const correct = editable ? (punch: TimecardPunch) => openDialog({ replace: punch }) : undefined;

  return (
    <div
      className={mergeClasses(styles.page, card.isPlaceholderData && styles.loading)}
      aria-busy={card.isFetching}
    >
      {data.flags.length > 0 && (
        <div className={styles.flags}>
          {data.flags.map((flag) => (
            <MessageBar key={flag} intent="warning" layout="multiline" className={styles.flag}>
              <MessageBarBody>
                <MessageBarTitle>Check this card</MessageBarTitle>
                {flag}
              </MessageBarBody>
            </MessageBar>
          ))}
        </div>
      )}
      {data.closed && canCorrect && (
        <MessageBar intent="info">
          <MessageBarBody>
            <MessageBarTitle>Closed for pay</MessageBarTitle>
            Nothing dated in this week can change. The owner can reopen it from the pay summary.
          </MessageBarBody>
        </MessageBar>
      )}
      {saved && (
        <MessageBar intent="success">
          <MessageBarBody>{saved}</MessageBarBody>
        </MessageBar>
      )}

      <div className={styles.bar}>
        <Total label="Attendance" seconds={totals.attendanceSeconds} />
        <Total label="On jobs" seconds={totals.clockedSeconds} />
        <Total label="Idle at work" seconds={totals.idleSeconds} />
        <Total label="Meal breaks (unpaid)" seconds={totals.mealBreakSeconds} />
        <Total label="Rest breaks (paid)" seconds={totals.restBreakSeconds} />
        <span className={styles.spacer} />
        <div className={styles.actions}>
          <Caption1 className={styles.dim}>
            {shown.length} punches
            {corrections > 0 && `, ${corrections} by correction`}
            {takenOut > 0 && `, ${takenOut} taken out`}
          </Caption1>
          {editable && (
            <Button appearance="primary" onClick={() => openDialog({ add: true })}>
              Add a missed punch…
            </Button>
          )}
        </div>
      </div>

      <Card className={styles.panel}>
        <WeekReview card={data} />
      </Card>

      <Card className={styles.panel}>
        <WeekGlance days={days} timeZone={data.timeZone} />
      </Card>

      <Card className={styles.panel}>
        <Subtitle2 as="h2">Day by day</Subtitle2>
        {activeDays.length === 0 ? (
          <Text className={styles.dim}>No punches this week.</Text>
        ) : (
          <div className={styles.days}>
            {activeDays.map((day) => (
              <DayDetail key={day.day} day={day} timeZone={data.timeZone} onCorrect={correct} />
            ))}
          </div>
        )}
      </Card>

      <Card className={styles.panel}>
        <AuditTrail card={data} />
      </Card>

      {target && (
        <CorrectionDialog
          key={target.n}
          open={target.shown}
          card={data}
          target={target.of}
          onClose={closeDialog}
          onSaved={(message) => {
            closeDialog();
            setSaved({ for: `${technicianId}/${week}`, text: message });
          }}
        />
      )}
    </div>
  );
}
