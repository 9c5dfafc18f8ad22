import {
  Caption1,
  Subtitle2,
  makeStyles,
  mergeClasses,
  shorthands,
  tokens,
} from '@fluentui/react-components';
import { useRef } from 'react';
import { useElementWidth } from '@/hooks/use-element-width';
import { formatClock, formatDay, formatHours } from '../timecard-format';
import { PERSON_STATUS_WORDS } from '@baytime/shared';
import {
  timelineSegments,
  timelineWindow,
  type CardDay,
  type TimelineSegment,
  type TimelineWindow,
} from '../timecard-model';

const useStyles = makeStyles({
  section: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalS },
  grid: {
    display: 'grid',
    gridTemplateColumns: '7.5rem minmax(0, 1fr) repeat(3, 4.75rem)',
    columnGap: tokens.spacingHorizontalM,
    alignItems: 'center',
  },
  head: { color: tokens.colorNeutralForeground3, paddingBottom: tokens.spacingVerticalXS },
  number: { textAlign: 'right', fontVariantNumeric: 'tabular-nums' },
  row: {
    minHeight: '2.75rem',
    ...shorthands.borderTop(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke2),
  },
  dayLink: {
    color: tokens.colorNeutralForeground1,
    textDecorationLine: 'none',
    fontWeight: tokens.fontWeightSemibold,
    ':hover': { textDecorationLine: 'underline' },
    ':focus-visible': { outline: `2px solid ${tokens.colorStrokeFocus2}`, outlineOffset: '2px' },
  },
  quiet: { color: tokens.colorNeutralForeground3, fontWeight: tokens.fontWeightRegular },
  axis: { position: 'relative', height: '1.1rem' },
  tick: {
    position: 'absolute',
    top: 0,
    transform: 'translateX(-50%)',
    whiteSpace: 'nowrap',
    fontSize: tokens.fontSizeBase100,
    color: tokens.colorNeutralForeground3,
  },
  track: {
    position: 'relative',
    height: '2.25rem',
    margin: `${tokens.spacingVerticalXS} 0`,
    borderRadius: tokens.borderRadiusSmall,
    backgroundImage: `linear-gradient(to right, ${tokens.colorNeutralStroke3} 1px, transparent 1px)`,
  },
  segment: {
    position: 'absolute',
    boxSizing: 'border-box',
    overflow: 'hidden',
    whiteSpace: 'nowrap',
    fontSize: tokens.fontSizeBase100,
    lineHeight: '1',
    display: 'flex',
    alignItems: 'center',
    paddingLeft: '3px',
    borderRadius: tokens.borderRadiusSmall,
  },
  shift: {
    top: 0,
    height: '45%',
    backgroundColor: tokens.colorNeutralStroke2,
    ...shorthands.border(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke1),
  },
  meal: {
    top: 0,
    height: '45%',
    color: tokens.colorNeutralForeground1,
    ...shorthands.border(tokens.strokeWidthThin, 'solid', tokens.colorNeutralStroke1),
    backgroundColor: tokens.colorNeutralBackground1,
    backgroundImage: `repeating-linear-gradient(135deg, ${tokens.colorNeutralStroke1} 0 2px, transparent 2px 6px)`,
  },
  rest: {
    top: 0,
    height: '45%',
    ...shorthands.border(tokens.strokeWidthThin, 'dashed', tokens.colorNeutralStroke1),
    backgroundColor: tokens.colorNeutralBackground1,
  },
  job: {
    color: tokens.colorNeutralForegroundOnBrand,
    backgroundColor: tokens.colorBrandBackground,
    ...shorthands.border(tokens.strokeWidthThin, 'solid', tokens.colorNeutralBackground1),
  },
  open: {
    borderRightStyle: 'dashed',
    borderRightWidth: '3px',
    borderRightColor: tokens.colorStatusWarningBorderActive,
  },
  legend: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalL,
    color: tokens.colorNeutralForeground2,
    fontSize: tokens.fontSizeBase200,
  },
  key: { display: 'inline-flex', alignItems: 'center', gap: tokens.spacingHorizontalXS },
  swatch: { position: 'static', width: '1.5rem', height: '0.75rem', display: 'inline-block', padding: 0 },
});

/** Steps between the axis's labels, in minutes: the first that leaves each label room. */
const TICK_STEPS = [60, 120, 180, 240, 360, 720];
/** Room a label such as "12:00 pm" needs at the axis's size, with a gap, in CSS pixels. */
const TICK_ROOM_PX = 56;

function tickMinutes(window: TimelineWindow, axisWidthPx: number): number[] {
  const span = window.endMinute - window.startMinute;
  // Before the axis is laid out, as on a wide screen.
  const room = axisWidthPx > 0 ? axisWidthPx : 900;
  const step =
    TICK_STEPS.find((minutes) => (span / minutes + 1) * TICK_ROOM_PX <= room) ?? TICK_STEPS.at(-1)!;
  const ticks: number[] = [];
  for (let m = Math.ceil(window.startMinute / step) * step; m <= window.endMinute; m += step) ticks.push(m);
  return ticks;
}

function segmentText(segment: TimelineSegment, timeZone: string): string {
  const what =
    segment.kind === 'job'
      ? segment.label
      : segment.kind === 'shift'
        ? 'Shift'
        : segment.kind === 'meal'
          ? 'Meal break'
          : 'Rest break';
  const until = segment.open ? 'still running' : formatClock(segment.to, timeZone);
  return `${what}: ${formatClock(segment.from, timeZone)} – ${until}`;
}

function Timeline({ day, window, timeZone }: { day: CardDay; window: TimelineWindow; timeZone: string }) {
  const styles = useStyles();
  const segments = timelineSegments(day, window);
  const lanes = Math.max(1, ...segments.filter((s) => s.kind === 'job').map((s) => s.lane + 1));
  const laneHeight = 55 / lanes;
  return (
    <div className={styles.track} aria-hidden="true">
      {segments.map((segment, index) => {
        const isJob = segment.kind === 'job';
        const style = {
          left: `${segment.left}%`,
          width: `${segment.width}%`,
          ...(isJob ? { top: `${45 + segment.lane * laneHeight}%`, height: `${laneHeight}%` } : {}),
        };
        const wide = segment.width > 7;
        return (
          <div
            key={index}
            title={segmentText(segment, timeZone)}
            style={style}
            className={mergeClasses(styles.segment, styles[segment.kind], segment.open && styles.open)}
          >
            {wide && isJob && lanes === 1 ? segment.label?.split(' · ')[0] : null}
            {wide && segment.kind === 'meal' ? 'meal' : null}
            {wide && segment.kind === 'rest' ? 'rest' : null}
          </div>
        );
      })}
    </div>
  );
}

/** The week on one time axis: one row per workday, shift with breaks above and jobs below. */
export function WeekGlance({ days, timeZone }: { days: readonly CardDay[]; timeZone: string }) {
  const styles = useStyles();
  const window = timelineWindow(days);
  const first = days[0];
  const axisRef = useRef<HTMLDivElement>(null);
  const ticks = tickMinutes(window, useElementWidth(axisRef));
  const span = window.endMinute - window.startMinute;
  return (
    <section className={styles.section} aria-labelledby="week-glance-title">
      <Subtitle2 as="h2" id="week-glance-title">
        The week at a glance
      </Subtitle2>
      <div className={styles.grid}>
        <span />
        <div className={styles.axis} aria-hidden="true" ref={axisRef}>
          {first &&
            ticks.map((minute) => (
              <span
                key={minute}
                className={styles.tick}
                style={{
                  left: `${((minute - window.startMinute) / span) * 100}%`,
                  // The axis ends keep their labels inside the track.
                  transform:
                    minute === window.startMinute
                      ? 'none'
                      : minute === window.endMinute
                        ? 'translateX(-100%)'
                        : undefined,
                }}
              >
                {formatClock(new Date(first.from.getTime() + minute * 60_000), timeZone)}
              </span>
            ))}
        </div>
        <Caption1 className={mergeClasses(styles.head, styles.number)}>Attendance</Caption1>
        <Caption1 className={mergeClasses(styles.head, styles.number)}>On jobs</Caption1>
        <Caption1 className={mergeClasses(styles.head, styles.number)}>{PERSON_STATUS_WORDS.idle}</Caption1>
        {days.map((day) => (
          <div
            key={day.day}
            className={mergeClasses(styles.grid, styles.row)}
            style={{ gridColumn: '1 / -1' }}
          >
            {day.active ? (
              <a className={styles.dayLink} href={`#day-${day.day}`}>
                {formatDay(day.day)}
              </a>
            ) : (
              <span className={mergeClasses(styles.dayLink, styles.quiet)}>{formatDay(day.day)}</span>
            )}
            {day.active ? (
              <Timeline day={day} window={window} timeZone={timeZone} />
            ) : (
              <Caption1 className={styles.quiet}>No punches</Caption1>
            )}
            <span className={styles.number}>
              {day.active ? formatHours(day.totals.attendanceSeconds) : '–'}
            </span>
            <span className={styles.number}>{day.active ? formatHours(day.totals.clockedSeconds) : '–'}</span>
            <span className={styles.number}>{day.active ? formatHours(day.totals.idleSeconds) : '–'}</span>
          </div>
        ))}
      </div>
      <div className={styles.legend} aria-hidden="true">
        <span className={styles.key}>
          <span className={mergeClasses(styles.segment, styles.shift, styles.swatch)} /> Shift
        </span>
        <span className={styles.key}>
          <span className={mergeClasses(styles.segment, styles.meal, styles.swatch)} /> Meal break (unpaid)
        </span>
        <span className={styles.key}>
          <span className={mergeClasses(styles.segment, styles.rest, styles.swatch)} /> Rest break (paid)
        </span>
        <span className={styles.key}>
          <span className={mergeClasses(styles.segment, styles.job, styles.swatch)} /> Clocked on a job
        </span>
        <span className={styles.key}>
          <span className={mergeClasses(styles.segment, styles.shift, styles.open, styles.swatch)} /> Still
          running
        </span>
      </div>
    </section>
  );
}
