import {
  Caption1,
  Table,
  TableBody,
  TableCell,
  TableHeader,
  TableHeaderCell,
  TableRow,
  makeStyles,
  tokens,
} from '@fluentui/react-components';
import type { LabourReportTechnician } from '@baytime/shared';
import { formatHours, overUnderText, sortLines } from '../report-format';

const useStyles = makeStyles({
  table: { tableLayout: 'auto' },
  numButton: { justifyContent: 'flex-end', textAlign: 'right' },
  num: { textAlign: 'right', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  ro: { whiteSpace: 'nowrap', fontVariantNumeric: 'tabular-nums', fontWeight: tokens.fontWeightSemibold },
  over: { color: tokens.colorPaletteRedForeground1, fontWeight: tokens.fontWeightSemibold },
  under: { color: tokens.colorStatusSuccessForeground1 },
  open: { color: tokens.colorNeutralForeground3 },
  total: { fontWeight: tokens.fontWeightSemibold },
});

/** A technician's job lines this week: book time against the time they really clocked. */
export function TechnicianLines({ technician }: { technician: LabourReportTechnician }) {
  const styles = useStyles();
  const lines = sortLines(technician.lines);
  // Added up on the server from the seconds: a sum of the rounded lines can be off in the last place.
  const totals = technician.lineTotals;
  return (
    <Table size="small" className={styles.table} aria-label={`${technician.name}: job lines this week`}>
      <TableHeader>
        <TableRow>
          <TableHeaderCell>RO</TableHeaderCell>
          <TableHeaderCell>Job line</TableHeaderCell>
          <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
            Book h
          </TableHeaderCell>
          <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
            Flagged h
          </TableHeaderCell>
          <TableHeaderCell className={styles.num} button={{ className: styles.numButton }}>
            Clocked this week h
          </TableHeaderCell>
          <TableHeaderCell>Over / under book</TableHeaderCell>
        </TableRow>
      </TableHeader>
      <TableBody>
        {lines.map((line) => {
          const tone =
            line.overUnderHours === null
              ? styles.open
              : line.overUnderHours < -0.05
                ? styles.over
                : line.overUnderHours > 0.05
                  ? styles.under
                  : undefined;
          return (
            <TableRow key={line.jobLineId}>
              <TableCell className={styles.ro}>{line.repairOrderNumber}</TableCell>
              <TableCell>{line.title}</TableCell>
              <TableCell className={styles.num}>{formatHours(line.bookHours)}</TableCell>
              <TableCell className={styles.num}>{formatHours(line.flaggedHours)}</TableCell>
              <TableCell className={styles.num}>{formatHours(line.clockedHours, 2)}</TableCell>
              <TableCell className={tone}>{overUnderText(line.overUnderHours)}</TableCell>
            </TableRow>
          );
        })}
        <TableRow className={styles.total}>
          <TableCell />
          <TableCell>
            All lines{' '}
            <Caption1>(over/under counts all the time clocked on a line, earlier weeks too)</Caption1>
          </TableCell>
          <TableCell className={styles.num}>{formatHours(totals.bookHours)}</TableCell>
          <TableCell className={styles.num}>{formatHours(totals.flaggedHours)}</TableCell>
          <TableCell className={styles.num}>{formatHours(totals.clockedHours, 2)}</TableCell>
          <TableCell />
        </TableRow>
      </TableBody>
    </Table>
  );
}
