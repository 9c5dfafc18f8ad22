import {
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  mergeClasses,
  tokens,
} from '@fluentui/react-components';
import type { LabourReport } from '@baytime/shared';
import { formatPercent, shortDay } from '../report-format';

const useStyles = makeStyles({
  table: { tableLayout: 'auto', width: 'auto', minWidth: '40rem' },
  scroll: { overflowX: 'auto' },
  numButton: { justifyContent: 'flex-end', textAlign: 'right' },
  num: { textAlign: 'right', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap', width: '5.5rem' },
  share: { display: 'flex', flexDirection: 'column', alignItems: 'flex-end', gap: '2px' },
  meter: {
    width: '100%',
    maxWidth: '4.5rem',
    height: '5px',
    borderRadius: '3px',
    backgroundColor: tokens.colorNeutralBackground5,
    overflow: 'hidden',
    '@media print': { border: '1px solid #000' },
  },
  fill: {
    height: '100%',
    backgroundColor: tokens.colorBrandBackground,
    '@media print': { backgroundColor: '#000' },
  },
  week: { fontWeight: tokens.fontWeightSemibold },
  bay: { whiteSpace: 'nowrap' },
  blank: { color: tokens.colorNeutralForeground4 },
});

function Share({ value, strong }: { value: number | null; strong?: boolean }) {
  const styles = useStyles();
  if (value === null)
    return (
      <span className={styles.blank} aria-label="no opening hours">
        –
      </span>
    );
  return (
    <span className={styles.share}>
      <span className={strong ? styles.week : undefined}>{formatPercent(value)}</span>
      <span className={mergeClasses('bt-print-ink', styles.meter)} aria-hidden="true">
        <span
          className={mergeClasses('bt-meter-fill', styles.fill)}
          style={{ width: `${Math.min(100, value * 100)}%`, display: 'block' }}
        />
      </span>
    </span>
  );
}

/** Each bay's busy share of the opening hours, per day and for the week so far. */
export function BayUtilisationTable({ report }: { report: LabourReport }) {
  const styles = useStyles();
  const days = report.bayUtilisation[0]?.days.map((day) => day.day) ?? [];
  if (report.bayUtilisation.length === 0) return <span className={styles.blank}>No bays.</span>;
  return (
    <div className={mergeClasses('bt-print-wide', styles.scroll)}>
      <Table size="small" className={styles.table} aria-label="Bay use per day">
        <TableHeader>
          <TableRow>
            <TableHeaderCell>Bay</TableHeaderCell>
            {days.map((day) => (
              <TableHeaderCell key={day} className={styles.num} button={{ className: styles.numButton }}>
                {shortDay(day)}
              </TableHeaderCell>
            ))}
            <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
              Week
            </TableHeaderCell>
          </TableRow>
        </TableHeader>
        <TableBody>
          {report.bayUtilisation.map((bay) => (
            <TableRow key={bay.bayId}>
              <TableCell className={styles.bay}>{bay.name}</TableCell>
              {bay.days.map((day) => (
                <TableCell key={day.day} className={styles.num}>
                  <Share value={day.share} />
                </TableCell>
              ))}
              <TableCell className={styles.num}>
                <Share value={bay.week} strong />
              </TableCell>
            </TableRow>
          ))}
        </TableBody>
      </Table>
    </div>
  );
}
