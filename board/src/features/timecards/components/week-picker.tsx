import { Button, Caption1, Text, makeStyles, tokens } from '@fluentui/react-components';
import type { WorkweekSettings } from '@baytime/shared';
import { currentWeek, isAfterWeek, shiftWeek, weekName, weekRangeText } from '../week-label';

const useStyles = makeStyles({
  picker: {
    display: 'inline-flex',
    alignItems: 'center',
    gap: tokens.spacingHorizontalS,
  },
  label: {
    display: 'flex',
    flexDirection: 'column',
    alignItems: 'center',
    minWidth: '15.5rem',
    padding: `0 ${tokens.spacingHorizontalS}`,
  },
  range: { color: tokens.colorNeutralForeground3, fontVariantNumeric: 'tabular-nums' },
  arrow: { minWidth: '2.5rem', fontSize: tokens.fontSizeBase400 },
});

/** Previous / this / next shop workweek, with the dates each covers. Weeks after this one are not offered. */
export function WeekPicker({
  week,
  settings,
  onChange,
}: {
  week: string;
  settings: WorkweekSettings;
  onChange: (week: string) => void;
}) {
  const styles = useStyles();
  const thisWeek = currentWeek(settings);
  const next = shiftWeek(week, 1);
  const previous = shiftWeek(week, -1);
  const atLatest = !isAfterWeek(thisWeek, week);
  return (
    <div className={styles.picker} role="group" aria-label="Workweek">
      <Button
        className={styles.arrow}
        aria-label="Previous week"
        title={weekRangeText(previous, settings)}
        onClick={() => onChange(previous)}
      >
        ‹
      </Button>
      <div className={styles.label} aria-live="polite">
        <Text weight="semibold">
          {weekName(week, settings)}
          {week === thisWeek && ' (this week)'}
        </Text>
        <Caption1 className={styles.range}>{weekRangeText(week, settings)}</Caption1>
      </div>
      <Button
        className={styles.arrow}
        aria-label="Next week"
        title={atLatest ? undefined : weekRangeText(next, settings)}
        disabled={atLatest}
        onClick={() => onChange(next)}
      >
        ›
      </Button>
      <Button appearance="subtle" disabled={week === thisWeek} onClick={() => onChange(thisWeek)}>
        This week
      </Button>
    </div>
  );
}
