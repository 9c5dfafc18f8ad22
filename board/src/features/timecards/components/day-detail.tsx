import {
  Badge,
  Button,
  Caption1,
  Subtitle2,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  Text,
  makeStyles,
  shorthands,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import { PERSON_STATUS_WORDS, type TimecardPunch } from '@baytime/shared';
import {
  BREAK_WORDS,
  PUNCH_WORDS,
  formatClock,
  formatDay,
  formatDayClock,
  formatHours,
} from '../timecard-format';
import {
  overlappedJobSeconds,
  sharedCredit,
  type CardDay,
  type CardInterval,
  type PunchRow,
} from '../timecard-model';

const useStyles = makeStyles({
  day: {
    display: 'flex',
    flexDirection: 'column',
    gap: tokens.spacingVerticalS,
    paddingTop: tokens.spacingVerticalL,
    ...shorthands.borderTop(tokens.strokeWidthThick, 'solid', tokens.colorNeutralStroke2),
    scrollMarginTop: tokens.spacingVerticalXXL,
  },
  head: { display: 'flex', flexWrap: 'wrap', alignItems: 'baseline', gap: tokens.spacingHorizontalXL },
  figures: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalL,
    color: tokens.colorNeutralForeground2,
  },
  figure: { fontVariantNumeric: 'tabular-nums' },
  columns: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 3fr) minmax(17rem, 2fr)',
    gap: tokens.spacingHorizontalXXL,
    alignItems: 'start',
    '@media (max-width: 1500px)': { gridTemplateColumns: 'minmax(0, 1fr)' },
  },
  table: { tableLayout: 'auto' },
  time: { whiteSpace: 'nowrap', fontVariantNumeric: 'tabular-nums', width: '6rem' },
  struck: { textDecorationLine: 'line-through', color: tokens.colorNeutralForeground3 },
  note: { display: 'block', color: tokens.colorNeutralForeground2 },
  warn: {
    display: 'block',
    color: tokens.colorStatusWarningForeground1,
    fontWeight: tokens.fontWeightSemibold,
  },
  actions: { width: '7rem', textAlign: 'right' },
  intervals: { listStyleType: 'none', margin: 0, padding: 0, display: 'flex', flexDirection: 'column' },
  interval: {
    display: 'grid',
    gridTemplateColumns: 'minmax(0, 1fr) auto',
    gap: tokens.spacingHorizontalM,
    padding: `${tokens.spacingVerticalXS} 0`,
    ...shorthands.borderBottom(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke3),
  },
  indent: { paddingLeft: tokens.spacingHorizontalL },
  duration: { fontVariantNumeric: 'tabular-nums', textAlign: 'right' },
  dim: { color: tokens.colorNeutralForeground3 },
});

function PunchWhat({ row, timeZone }: { row: PunchRow; timeZone: string }) {
  const styles = useStyles();
  const { punch } = row;
  const struck = row.replacedBy !== null;
  return (
    <>
      <span className={struck ? styles.struck : undefined}>
        <Text weight="semibold">{PUNCH_WORDS[punch.kind]}</Text>
        {punch.breakKind && ` · ${BREAK_WORDS[punch.breakKind]}`}
        {row.job && ` · ${row.job}`}
      </span>
      {row.replacedBy && (
        <Caption1 className={styles.note}>
          {row.replacedBy.voids ? 'Taken out of the count by' : 'Replaced by'} {row.replacedBy.recordedByName}
          : “{row.replacedBy.reason}”
        </Caption1>
      )}
      {row.correction && (
        <Caption1 className={styles.note}>
          {row.replaces
            ? `Corrects ${PUNCH_WORDS[row.replaces.kind].toLowerCase()} at ${formatClock(row.replaces.at, timeZone)}`
            : 'Recorded'}{' '}
          by {punch.recordedByName}, {formatDayClock(punch.recordedAt, timeZone)}: “{punch.reason}”
        </Caption1>
      )}
      {row.notCounted && <Caption1 className={styles.warn}>Not counted: {row.notCounted}</Caption1>}
    </>
  );
}

function intervalName(interval: CardInterval): string {
  if (interval.kind === 'job') return interval.label ?? 'Job';
  if (interval.kind === 'shift') return 'Shift';
  return BREAK_WORDS[interval.kind];
}

function IntervalList({ day, timeZone }: { day: CardDay; timeZone: string }) {
  const styles = useStyles();
  if (day.intervals.length === 0)
    return (
      <Caption1 className={styles.dim}>
        No time starts on this day (it carries on from the day before).
      </Caption1>
    );
  const overlapped = overlappedJobSeconds(day);
  return (
    <>
      <ul className={styles.intervals} aria-label={`Time on ${formatDay(day.day)}`}>
        {day.intervals.map((interval, index) => {
          const seconds = (interval.to.getTime() - interval.from.getTime()) / 1000;
          const crosses = interval.to.getTime() > day.to.getTime();
          const shared = sharedCredit(interval);
          return (
            <li
              key={index}
              className={mergeClasses(styles.interval, interval.kind !== 'shift' && styles.indent)}
            >
              <span>
                <Text weight={interval.kind === 'shift' ? 'semibold' : 'regular'}>
                  {intervalName(interval)}
                </Text>
                <Caption1 className={styles.note}>
                  {interval.from < day.from
                    ? formatDayClock(interval.from, timeZone)
                    : formatClock(interval.from, timeZone)}{' '}
                  – {crosses ? formatDayClock(interval.to, timeZone) : formatClock(interval.to, timeZone)}
                  {interval.open && ' (still running)'}
                  {shared && ` · run beside other lines, ${formatHours(shared.seconds)} in all`}
                </Caption1>
              </span>
              <span className={styles.duration}>{formatHours(shared ? shared.counted : seconds)}</span>
            </li>
          );
        })}
      </ul>
      {overlapped > 0 && (
        <Caption1 className={styles.dim}>
          Jobs ran at the same time for {formatHours(overlapped)}: On jobs counts that time once, and each
          line shows what the shop’s split rule credits it.
        </Caption1>
      )}
    </>
  );
}

export function DayDetail({
  day,
  timeZone,
  onCorrect,
}: {
  day: CardDay;
  timeZone: string;
  onCorrect?: (punch: TimecardPunch) => void;
}) {
  const styles = useStyles();
  const { totals } = day;
  return (
    <section className={styles.day} id={`day-${day.day}`} aria-labelledby={`day-${day.day}-title`}>
      <div className={styles.head}>
        <Subtitle2 as="h3" id={`day-${day.day}-title`}>
          {formatDay(day.day)}
        </Subtitle2>
        <div className={styles.figures}>
          <span className={styles.figure}>Attendance {formatHours(totals.attendanceSeconds)}</span>
          <span className={styles.figure}>On jobs {formatHours(totals.clockedSeconds)}</span>
          <span
            className={styles.figure}
          >{`${PERSON_STATUS_WORDS.idle} ${formatHours(totals.idleSeconds)}`}</span>
          {totals.mealBreakSeconds > 0 && (
            <span className={styles.figure}>Meal breaks {formatHours(totals.mealBreakSeconds)}</span>
          )}
          {totals.restBreakSeconds > 0 && (
            <span className={styles.figure}>Rest breaks {formatHours(totals.restBreakSeconds)}</span>
          )}
        </div>
      </div>
      <div className={styles.columns}>
        {day.punches.length === 0 ? (
          <Caption1 className={styles.dim}>No punches on this day.</Caption1>
        ) : (
          <Table size="small" className={styles.table} aria-label={`Punches on ${formatDay(day.day)}`}>
            <TableHeader>
              <TableRow>
                <TableHeaderCell className={styles.time}>Time</TableHeaderCell>
                <TableHeaderCell>Punch</TableHeaderCell>
                <TableHeaderCell>Recorded by</TableHeaderCell>
                {onCorrect && (
                  <TableHeaderCell className={styles.actions}>
                    <span className="visually-hidden">Actions</span>
                  </TableHeaderCell>
                )}
              </TableRow>
            </TableHeader>
            <TableBody>
              {day.punches.map((row) => (
                <TableRow key={row.punch.id}>
                  <TableCell className={mergeClasses(styles.time, row.replacedBy !== null && styles.struck)}>
                    {formatClock(row.punch.at, timeZone)}
                  </TableCell>
                  <TableCell>
                    <PunchWhat row={row} timeZone={timeZone} />
                  </TableCell>
                  <TableCell>
                    {row.punch.recordedByName}
                    {row.correction && (
                      <>
                        {' '}
                        <Badge appearance="outline" color="informative" size="small">
                          correction
                        </Badge>
                      </>
                    )}
                  </TableCell>
                  {onCorrect && (
                    <TableCell className={styles.actions}>
                      {row.replacedBy ? (
                        <Caption1 className={styles.dim}>
                          {row.replacedBy.voids ? 'taken out' : 'replaced'}
                        </Caption1>
                      ) : (
                        <Button
                          size="small"
                          appearance="subtle"
                          onClick={() => onCorrect(row.punch)}
                          aria-label={`Correct ${PUNCH_WORDS[row.punch.kind].toLowerCase()} at ${formatClock(row.punch.at, timeZone)}`}
                        >
                          Correct…
                        </Button>
                      )}
                    </TableCell>
                  )}
                </TableRow>
              ))}
            </TableBody>
          </Table>
        )}
        <IntervalList day={day} timeZone={timeZone} />
      </div>
    </section>
  );
}
