import {
  Badge,
  Caption1,
  MessageBar,
  MessageBarBody,
  MessageBarTitle,
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
import type { PayReport } from '@baytime/shared';
import { formatMoney } from '@/lib/form-errors';
import { formatHours, payNotes, type PayNoteTone } from '../report-format';
import { ReportSection, Stat, StatGrid } from './report-parts';

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  caution: {
    '@media print': { border: '2px solid #000', backgroundColor: '#fff' },
  },
  cautionTitle: { fontSize: tokens.fontSizeBase400 },
  rules: { color: tokens.colorNeutralForeground2 },
  scroll: { overflowX: 'auto' },
  table: { tableLayout: 'auto', minWidth: '52rem' },
  numButton: { justifyContent: 'flex-end', textAlign: 'right', whiteSpace: 'normal' },
  num: { textAlign: 'right', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  head: { verticalAlign: 'bottom', lineHeight: tokens.lineHeightBase200, whiteSpace: 'normal' },
  name: { minWidth: '10rem', '@media print': { minWidth: 0 } },
  rates: { display: 'block', color: tokens.colorNeutralForeground3 },
  badge: { whiteSpace: 'nowrap' },
  notes: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalXS,
    marginTop: tokens.spacingVerticalXXS,
  },
  under: {
    backgroundColor: tokens.colorPaletteRedBackground1,
    boxShadow: `inset 4px 0 0 ${tokens.colorPaletteRedBorder2}`,
    ':hover': { backgroundColor: tokens.colorPaletteRedBackground1 },
    '@media print': { boxShadow: 'inset 4px 0 0 #000' },
  },
  near: {
    boxShadow: `inset 4px 0 0 ${tokens.colorStatusWarningBorder2}`,
    '@media print': { boxShadow: 'inset 4px 0 0 #000' },
  },
  total: {
    fontWeight: tokens.fontWeightSemibold,
    ...shorthands.borderTop(tokens.strokeWidthThick, 'solid', tokens.colorNeutralStroke1),
  },
  strong: { fontWeight: tokens.fontWeightBold },
  terms: {
    display: 'grid',
    gridTemplateColumns: 'minmax(10rem, max-content) minmax(0, 1fr)',
    columnGap: tokens.spacingHorizontalL,
    rowGap: tokens.spacingVerticalXS,
    margin: 0,
  },
  term: { fontWeight: tokens.fontWeightSemibold },
  definition: { margin: 0, color: tokens.colorNeutralForeground2 },
});

// Fluent's warning badge is a bay-state yellow: a pay warning is the strong neutral.
const BADGE_COLOUR: Record<PayNoteTone, 'danger' | 'important' | 'informative'> = {
  danger: 'danger',
  warning: 'important',
  informative: 'informative',
};

const RULE_WORDS: Record<PayReport['rules'], string> = {
  federal: 'US federal: time and a half over 40 hours in the workweek',
  california:
    'California: time and a half over 8 hours a day or 40 a week, double time over 12 hours a day and on the seventh day',
};

/** The estimate caution, in the words the brief asks for and the server's own. */
export const PAY_CAUTION_TITLE = 'An estimate: confirm with local wage law and your payroll provider';

export function PayReportView({ report }: { report: PayReport }) {
  const styles = useStyles();
  const { totals } = report;
  const under = report.technicians.filter((tech) => tech.underMinimumWage);
  const near = report.technicians.filter((tech) => tech.nearOvertime || tech.overtimeHours > 0);
  return (
    <div className={styles.stack}>
      <MessageBar intent="warning" layout="multiline" className={styles.caution}>
        <MessageBarBody>
          <MessageBarTitle className={styles.cautionTitle}>{PAY_CAUTION_TITLE}</MessageBarTitle>
          {report.caution}
        </MessageBarBody>
      </MessageBar>
      <Text className={styles.rules}>
        Overtime rules: {RULE_WORDS[report.rules]}. Minimum wage {formatMoney(report.minimumWageCents)} an
        hour, for every hour worked.
      </Text>

      <StatGrid>
        <Stat label="Estimated pay, all technicians" value={formatMoney(totals.totalCents)} />
        <Stat label="Flagged hours" value={formatHours(totals.flaggedHours, 2)} />
        <Stat label="Hours worked" value={formatHours(totals.hoursWorked, 2)} />
        <Stat
          label="Overtime hours"
          value={formatHours(totals.overtimeHours, 2)}
          note={near.length ? `${near.length} near or over 40 h` : 'Nobody near 40 h'}
          alert={near.length > 0}
        />
        <Stat
          label="Minimum-wage top-ups"
          value={formatMoney(totals.minimumWageTopUpCents)}
          note={under.length ? `${under.length} under the floor` : 'Nobody under the floor'}
          alert={under.length > 0}
        />
      </StatGrid>

      <ReportSection labelledBy="pay-title">
        <Subtitle2 as="h2" id="pay-title">
          Pay per technician
        </Subtitle2>
        <div className={mergeClasses('bt-print-wide', styles.scroll)}>
          <Table size="small" className={styles.table} aria-label="Pay per technician">
            <TableHeader>
              <TableRow>
                <TableHeaderCell className={mergeClasses(styles.head, styles.name)}>
                  Technician
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Flagged hours
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Flat-rate pay
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Pay for other time
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Straight-time pay
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Hours worked
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Regular rate
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Overtime hours
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Overtime premium
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Min-wage top-up
                </TableHeaderCell>
                <TableHeaderCell
                  className={mergeClasses(styles.head, styles.num)}
                  button={{ className: styles.numButton }}
                >
                  Total
                </TableHeaderCell>
              </TableRow>
            </TableHeader>
            <TableBody>
              {report.technicians.map((tech) => {
                const notes = payNotes(tech);
                return (
                  <TableRow
                    key={tech.technicianId}
                    className={
                      tech.underMinimumWage
                        ? styles.under
                        : tech.nearOvertime || tech.overtimeHours > 0
                          ? styles.near
                          : undefined
                    }
                  >
                    <TableCell className={styles.name}>
                      <Text weight="semibold">{tech.name}</Text>
                      <Caption1 className={styles.rates}>
                        Flat {formatMoney(tech.flatRateCents)} · hourly {formatMoney(tech.hourlyRateCents)}
                      </Caption1>
                      {notes.length > 0 && (
                        <span className={styles.notes}>
                          {notes.map((note) => (
                            <Badge
                              key={note.text}
                              appearance="tint"
                              color={BADGE_COLOUR[note.tone]}
                              size="small"
                              className={styles.badge}
                            >
                              {note.text}
                            </Badge>
                          ))}
                        </span>
                      )}
                    </TableCell>
                    <TableCell className={styles.num}>{formatHours(tech.flaggedHours, 2)}</TableCell>
                    <TableCell className={styles.num}>{formatMoney(tech.flaggedPayCents)}</TableCell>
                    <TableCell className={styles.num}>{formatMoney(tech.nonProductivePayCents)}</TableCell>
                    <TableCell className={styles.num}>{formatMoney(tech.straightTimeCents)}</TableCell>
                    <TableCell className={styles.num}>{formatHours(tech.hoursWorked, 2)}</TableCell>
                    <TableCell className={styles.num}>{formatMoney(tech.regularRateCents)}/h</TableCell>
                    <TableCell className={styles.num}>
                      {formatHours(tech.overtimeHours, 2)}
                      {tech.doubleTimeHours > 0 && (
                        <Caption1 className={styles.rates}>
                          {formatHours(tech.doubleTimeHours, 2)} double
                        </Caption1>
                      )}
                    </TableCell>
                    <TableCell className={styles.num}>{formatMoney(tech.overtimePremiumCents)}</TableCell>
                    <TableCell
                      className={mergeClasses(styles.num, tech.minimumWageTopUpCents > 0 && styles.strong)}
                    >
                      {formatMoney(tech.minimumWageTopUpCents)}
                    </TableCell>
                    <TableCell className={mergeClasses(styles.num, styles.strong)}>
                      {formatMoney(tech.totalCents)}
                    </TableCell>
                  </TableRow>
                );
              })}
              <TableRow className={styles.total}>
                <TableCell>All technicians</TableCell>
                <TableCell className={styles.num}>{formatHours(totals.flaggedHours, 2)}</TableCell>
                <TableCell className={styles.num}>{formatMoney(totals.flaggedPayCents)}</TableCell>
                <TableCell className={styles.num}>{formatMoney(totals.nonProductivePayCents)}</TableCell>
                <TableCell className={styles.num}>{formatMoney(totals.straightTimeCents)}</TableCell>
                <TableCell className={styles.num}>{formatHours(totals.hoursWorked, 2)}</TableCell>
                <TableCell />
                <TableCell className={styles.num}>{formatHours(totals.overtimeHours, 2)}</TableCell>
                <TableCell className={styles.num}>{formatMoney(totals.overtimePremiumCents)}</TableCell>
                <TableCell className={styles.num}>{formatMoney(totals.minimumWageTopUpCents)}</TableCell>
                <TableCell className={mergeClasses(styles.num, styles.strong)}>
                  {formatMoney(totals.totalCents)}
                </TableCell>
              </TableRow>
            </TableBody>
          </Table>
        </div>
      </ReportSection>

      <ReportSection labelledBy="pay-terms-title">
        <Subtitle2 as="h2" id="pay-terms-title">
          What the columns mean
        </Subtitle2>
        <dl className={styles.terms}>
          <dt className={styles.term}>Flat-rate pay</dt>
          <dd className={styles.definition}>Flagged hours × the technician’s flat rate.</dd>
          <dt className={styles.term}>Pay for other time</dt>
          <dd className={styles.definition}>
            Hours at work while clocked on no job (waiting, rest breaks, shop time) × the hourly rate, when
            the shop pays that time separately (Shop settings).
          </dd>
          <dt className={styles.term}>Straight-time pay</dt>
          <dd className={styles.definition}>Flat-rate pay plus pay for other time.</dd>
          <dt className={styles.term}>Hours worked</dt>
          <dd className={styles.definition}>Shift time less unpaid meal breaks; paid rest breaks count.</dd>
          <dt className={styles.term}>Regular rate</dt>
          <dd className={styles.definition}>
            Straight-time pay, plus any minimum-wage top-up, ÷ all hours worked in the week.
          </dd>
          <dt className={styles.term}>Overtime premium</dt>
          <dd className={styles.definition}>
            Half the regular rate for each overtime hour (the straight-time pay already covers the hour
            itself), the whole regular rate again for each double-time hour.
          </dd>
          <dt className={styles.term}>Min-wage top-up</dt>
          <dd className={styles.definition}>
            What it takes to bring the week’s pay up to the minimum wage for every hour worked.
          </dd>
        </dl>
      </ReportSection>
    </div>
  );
}
