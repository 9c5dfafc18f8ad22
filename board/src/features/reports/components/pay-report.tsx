import { useRef, type ReactNode } from 'react';
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
import {
  PAY_TYPE_WORDS,
  type PayReport,
  type PayReportTechnician,
  type PayReportTotals,
} from '@baytime/shared';
import { formatMoney } from '@/lib/form-errors';
import { useSidewaysScroll } from '../hooks/use-sideways-scroll';
import { formatHours, payNotes, type PayNoteTone } from '../report-format';
import { PayWeekStatus } from './pay-week-status';
import { ReportSection, Stat, StatGrid } from './report-parts';

const useStyles = makeStyles({
  stack: { display: 'flex', flexDirection: 'column', gap: tokens.spacingVerticalL },
  caution: {
    '@media print': { border: '2px solid #000', backgroundColor: '#fff' },
  },
  cautionTitle: { fontSize: tokens.fontSizeBase400 },
  rules: { color: tokens.colorNeutralForeground2, display: 'flex', flexDirection: 'column', gap: '4px' },
  scroll: { overflowX: 'auto' },
  cue: { color: tokens.colorNeutralForeground2, display: 'block' },
  // "Payable this week" stays at the right edge while the other columns scroll under it.
  stickyEnd: {
    position: 'sticky',
    right: 0,
    zIndex: 1,
    backgroundColor: tokens.colorNeutralBackground1,
    boxShadow: `inset 1px 0 0 ${tokens.colorNeutralStroke2}, -8px 0 8px -8px ${tokens.colorNeutralShadowKey}`,
    '@media print': { position: 'static', boxShadow: 'none' },
  },
  stickyUnder: { backgroundColor: tokens.colorPaletteRedBackground1 },
  // The technician stays at the left edge; the row's mark is drawn on the cell, which covers the row.
  stickyStart: {
    position: 'sticky',
    left: 0,
    zIndex: 1,
    backgroundColor: tokens.colorNeutralBackground1,
    boxShadow: `inset -1px 0 0 ${tokens.colorNeutralStroke2}`,
    '@media print': { position: 'static', boxShadow: 'none' },
  },
  nameUnder: {
    backgroundColor: tokens.colorPaletteRedBackground1,
    boxShadow: `inset 4px 0 0 ${tokens.colorPaletteRedBorder2}, inset -1px 0 0 ${tokens.colorNeutralStroke2}`,
    '@media print': { boxShadow: 'inset 4px 0 0 #000' },
  },
  nameNear: {
    boxShadow: `inset 4px 0 0 ${tokens.colorStatusWarningBorder2}, inset -1px 0 0 ${tokens.colorNeutralStroke2}`,
    '@media print': { boxShadow: 'inset 4px 0 0 #000' },
  },
  payableCautions: { margin: `${tokens.spacingVerticalXXS} 0 0`, paddingLeft: tokens.spacingHorizontalL },
  table: { tableLayout: 'auto', minWidth: '78rem' },
  numButton: { justifyContent: 'flex-end', textAlign: 'right', whiteSpace: 'normal' },
  num: { textAlign: 'right', fontVariantNumeric: 'tabular-nums', whiteSpace: 'nowrap' },
  head: { verticalAlign: 'bottom', lineHeight: tokens.lineHeightBase200, whiteSpace: 'normal' },
  name: { minWidth: '13rem', verticalAlign: 'top', '@media print': { minWidth: 0 } },
  sub: { display: 'block', color: tokens.colorNeutralForeground3 },
  badge: { whiteSpace: 'nowrap' },
  notes: {
    display: 'flex',
    flexWrap: 'wrap',
    gap: tokens.spacingHorizontalXS,
    marginTop: tokens.spacingVerticalXXS,
  },
  details: { marginTop: tokens.spacingVerticalXS, fontSize: tokens.fontSizeBase200 },
  detailList: { margin: `${tokens.spacingVerticalXXS} 0 0`, paddingLeft: tokens.spacingHorizontalL },
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
    'California: time and a half over 8 hours a day or 40 a week, double time over 12 hours a day and on the seventh day; rest periods and other non-productive time paid apart (Labor Code 226.2)',
};

/** The estimate caution, in the words the brief asks for and the server's own. */
export const PAY_CAUTION_TITLE = 'An estimate: confirm with local wage law and your payroll provider';

const hours = (value: number) => formatHours(value, 2);
const dash = (cents: number) => (cents === 0 ? '–' : formatMoney(cents));

interface Column {
  header: string;
  cell: (tech: PayReportTechnician) => ReactNode;
  /** The column's total, when it has one. */
  total?: (totals: PayReportTotals) => ReactNode;
  strong?: boolean;
  /** Kept in view at the right edge when the table scrolls sideways. */
  sticky?: boolean;
}

const COLUMNS: Column[] = [
  { header: 'Flagged hours', cell: (t) => hours(t.flaggedHours), total: (t) => hours(t.flaggedHours) },
  {
    header: 'Flat-rate pay',
    cell: (t) => (
      <>
        {dash(t.flaggedPayCents)}
        {t.guaranteeTopUpCents > 0 && (
          <Caption1Sub>+ {formatMoney(t.guaranteeTopUpCents)} guarantee</Caption1Sub>
        )}
      </>
    ),
    total: (t) => dash(t.flaggedPayCents + t.guaranteeTopUpCents),
  },
  { header: 'Hourly pay', cell: (t) => dash(t.hourlyPayCents), total: (t) => dash(t.hourlyPayCents) },
  {
    header: 'Rest periods',
    cell: (t) => (
      <>
        {dash(t.restPayCents)}
        {t.restHours > 0 && (
          <Caption1Sub>
            {hours(t.restHours)} h{t.restRateCents !== null && ` × ${formatMoney(t.restRateCents)}`}
          </Caption1Sub>
        )}
      </>
    ),
    total: (t) => dash(t.restPayCents),
  },
  {
    header: 'Other non-productive time',
    cell: (t) => (
      <>
        {dash(t.otherNonProductivePayCents)}
        {t.otherNonProductiveHours > 0 && <Caption1Sub>{hours(t.otherNonProductiveHours)} h</Caption1Sub>}
      </>
    ),
    total: (t) => dash(t.otherNonProductivePayCents),
  },
  {
    header: 'Straight-time pay',
    cell: (t) => formatMoney(t.straightTimeCents),
    total: (t) => formatMoney(t.straightTimeCents),
  },
  { header: 'Hours worked', cell: (t) => hours(t.hoursWorked), total: (t) => hours(t.hoursWorked) },
  { header: 'Regular rate', cell: (t) => `${formatMoney(t.regularRateCents)}/h` },
  { header: 'Overtime hours', cell: (t) => hours(t.overtimeHours), total: (t) => hours(t.overtimeHours) },
  {
    header: 'Double-time hours',
    cell: (t) => hours(t.doubleTimeHours),
    total: (t) => hours(t.doubleTimeHours),
  },
  {
    header: 'Overtime premium',
    cell: (t) => dash(t.overtimePremiumCents),
    total: (t) => dash(t.overtimePremiumCents),
  },
  {
    header: 'Min-wage top-up',
    cell: (t) => dash(t.minimumWageTopUpCents),
    total: (t) => dash(t.minimumWageTopUpCents),
  },
  {
    header: 'Meal premiums',
    cell: (t) => (
      <>
        {dash(t.mealPremiumCents)}
        {t.mealPremiumDays > 0 && <Caption1Sub>{t.mealPremiumDays} day(s)</Caption1Sub>}
      </>
    ),
    total: (t) => dash(t.mealPremiumCents),
  },
  { header: 'Week total', cell: (t) => formatMoney(t.totalCents), total: (t) => formatMoney(t.totalCents) },
  {
    header: 'Earlier weeks',
    cell: (t) => dash(t.additionalOvertimeCents + t.adjustmentCents),
    total: (t) => dash(t.additionalOvertimeCents + t.adjustmentCents),
  },
  {
    header: 'Payable this week',
    cell: (t) => (
      <>
        {formatMoney(t.payableCents)}
        {t.payableCaution && <Caption1Sub>below min. wage</Caption1Sub>}
      </>
    ),
    total: (t) => formatMoney(t.payableCents),
    strong: true,
    sticky: true,
  },
];

function Caption1Sub({ children }: { children: ReactNode }) {
  return <Caption1 className={useStyles().sub}>{children}</Caption1>;
}

function rateWords(tech: PayReportTechnician): string {
  const flat = `flat ${formatMoney(tech.flatRateCents)}`;
  const hourly = `hourly ${formatMoney(tech.hourlyRateCents)}`;
  const words =
    tech.payType === 'hourly'
      ? hourly
      : tech.payType === 'flat-rate-guarantee'
        ? `${flat} · guarantee ${formatMoney(tech.guaranteeCents)} · waiting ${formatMoney(tech.hourlyRateCents)}`
        : `${flat} · other time ${formatMoney(tech.hourlyRateCents)}`;
  return `${PAY_TYPE_WORDS[tech.payType]}: ${words} (from ${tech.rateFrom})`;
}

/** The technician's exceptions, overtime owed for earlier weeks and adjustments, in words. */
function Particulars({ tech }: { tech: PayReportTechnician }) {
  const styles = useStyles();
  const items = [
    ...tech.exceptions.map(
      (e) =>
        `${e.resolution ? 'Resolved' : 'To resolve'}: ${e.text}${e.resolution ? ` (${e.resolution.note})` : ''}`,
    ),
    ...tech.additionalOvertime.map(
      (extra) =>
        `Additional overtime for the ${extra.forWeekName.replace(/^Week/, 'week')}: ${formatMoney(extra.cents)}`,
    ),
    ...tech.adjustments.map(
      (a) =>
        `Adjustment for the ${a.forWeekName.replace(/^Week/, 'week')} (closed, changed since): ${formatMoney(a.cents)}, ${formatHours(a.flaggedHours, 2)} flagged h`,
    ),
  ];
  if (items.length === 0) return null;
  return (
    <details className={styles.details}>
      <summary>Details ({items.length})</summary>
      <ul className={styles.detailList}>
        {items.map((item) => (
          <li key={item}>{item}</li>
        ))}
      </ul>
    </details>
  );
}

export function PayReportView({ report }: { report: PayReport }) {
  const styles = useStyles();
  const { totals } = report;
  const under = report.technicians.filter((tech) => tech.underMinimumWage);
  const payableBelow = report.technicians.filter((tech) => Boolean(tech.payableCaution));
  const scroller = useRef<HTMLDivElement>(null);
  const sideways = useSidewaysScroll(scroller);
  const flagged = (tech: PayReportTechnician) => tech.underMinimumWage || Boolean(tech.payableCaution);
  const cellClass = (column: Column, tech?: PayReportTechnician) =>
    mergeClasses(
      styles.num,
      column.strong && styles.strong,
      column.sticky && styles.stickyEnd,
      column.sticky && tech && flagged(tech) && styles.stickyUnder,
    );
  const near = report.technicians.filter((tech) => tech.nearOvertime || tech.overtimeHours > 0);
  const { payRules } = report;
  return (
    <div className={styles.stack}>
      <MessageBar intent="warning" layout="multiline" className={styles.caution}>
        <MessageBarBody>
          <MessageBarTitle className={styles.cautionTitle}>{PAY_CAUTION_TITLE}</MessageBarTitle>
          {report.caution}
        </MessageBarBody>
      </MessageBar>
      <div className="bt-no-print">
        <PayWeekStatus report={report} />
      </div>
      <div className={styles.rules}>
        <Text>
          Overtime rules: {RULE_WORDS[report.rules]}. Minimum wage {formatMoney(report.minimumWageCents)} an
          hour for every hour worked: the highest of the federal
          {payRules.localMinimumWageCents !== null ? ', state and local' : ' and state'} figures in force when
          the week began (rules from {payRules.effectiveFrom}).
        </Text>
        <Text>
          Flagged pay is paid in the week the line is finished: that is the shop’s practice.{' '}
          {report.apportionSpanningLines
            ? 'For overtime, a line clocked over several weeks has its flat-rate pay shared over them in proportion to the time clocked in each, and the extra premium owed for an earlier week is paid here as additional overtime. 29 CFR 778.119–778.120 prescribe this for commissions; applying it to flat-rate pay is an analogy the shop chose (Shop settings): confirm it with counsel.'
            : 'The shop has turned off sharing such pay over earlier weeks for overtime (Shop settings).'}
        </Text>
        <Text>Rounding: {report.rounding}</Text>
      </div>

      <StatGrid>
        <Stat label="Payable this week, all technicians" value={formatMoney(totals.payableCents)} />
        <Stat label="Flagged hours" value={hours(totals.flaggedHours)} />
        <Stat label="Hours worked" value={hours(totals.hoursWorked)} />
        <Stat
          label="Overtime hours"
          value={hours(totals.overtimeHours)}
          note={near.length ? `${near.length} near or over 40 h` : 'Nobody near 40 h'}
          alert={near.length > 0}
        />
        <Stat
          label="Minimum-wage top-ups"
          value={formatMoney(totals.minimumWageTopUpCents)}
          note={
            [
              under.length > 0 && `${under.length} under the floor`,
              payableBelow.length > 0 && `${payableBelow.length} payable below the floor`,
            ]
              .filter(Boolean)
              .join(' · ') || 'Nobody under the floor'
          }
          alert={under.length + payableBelow.length > 0}
        />
        <Stat
          label="Exceptions to resolve"
          value={String(report.unresolvedExceptions)}
          note={report.unresolvedExceptions ? 'Figures not final' : 'None'}
          alert={report.unresolvedExceptions > 0}
        />
      </StatGrid>

      <ReportSection labelledBy="pay-title">
        <Subtitle2 as="h2" id="pay-title">
          Pay per technician
        </Subtitle2>
        {payableBelow.length > 0 && (
          <MessageBar intent="error" layout="multiline">
            <MessageBarBody>
              <MessageBarTitle>
                Payable below the minimum wage: confirm with payroll before paying
              </MessageBarTitle>
              <ul className={styles.payableCautions}>
                {payableBelow.map((tech) => (
                  <li key={tech.technicianId}>
                    <Text weight="semibold">{tech.name}</Text>: {tech.payableCaution}
                  </li>
                ))}
              </ul>
            </MessageBarBody>
          </MessageBar>
        )}
        {sideways.overflows && (
          <Caption1 className={mergeClasses('bt-no-print', styles.cue)} id="pay-scroll-cue">
            {sideways.atEnd ? '← ' : ''}The table is wider than the window: scroll it sideways for every
            column
            {sideways.atEnd ? '' : ' →'}. The technician stays at the left edge, Payable this week at the
            right.
          </Caption1>
        )}
        <div
          ref={scroller}
          className={mergeClasses('bt-print-wide', styles.scroll)}
          aria-describedby={sideways.overflows ? 'pay-scroll-cue' : undefined}
        >
          <Table size="small" className={styles.table} aria-label="Pay per technician">
            <TableHeader>
              <TableRow>
                <TableHeaderCell className={mergeClasses(styles.head, styles.name, styles.stickyStart)}>
                  Technician
                </TableHeaderCell>
                {COLUMNS.map((column) => (
                  <TableHeaderCell
                    key={column.header}
                    className={mergeClasses(styles.head, cellClass(column))}
                    button={{ className: styles.numButton }}
                  >
                    {column.header}
                  </TableHeaderCell>
                ))}
              </TableRow>
            </TableHeader>
            <TableBody>
              {report.technicians.map((tech) => {
                const notes = payNotes(tech);
                const mark = flagged(tech)
                  ? 'under'
                  : tech.nearOvertime || tech.overtimeHours > 0
                    ? 'near'
                    : null;
                return (
                  <TableRow
                    key={tech.technicianId}
                    className={mark === 'under' ? styles.under : mark === 'near' ? styles.near : undefined}
                  >
                    <TableCell
                      className={mergeClasses(
                        styles.name,
                        styles.stickyStart,
                        mark === 'under' && styles.nameUnder,
                        mark === 'near' && styles.nameNear,
                      )}
                    >
                      <Text weight="semibold">{tech.name}</Text>
                      <Caption1 className={styles.sub}>{rateWords(tech)}</Caption1>
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
                      <Particulars tech={tech} />
                    </TableCell>
                    {COLUMNS.map((column) => (
                      <TableCell key={column.header} className={cellClass(column, tech)}>
                        {column.cell(tech)}
                      </TableCell>
                    ))}
                  </TableRow>
                );
              })}
              <TableRow className={styles.total}>
                <TableCell className={styles.stickyStart}>All technicians</TableCell>
                {COLUMNS.map((column) => (
                  <TableCell key={column.header} className={cellClass(column)}>
                    {column.total?.(totals)}
                  </TableCell>
                ))}
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
          <dd className={styles.definition}>
            Flagged hours × the flat rate. With an hourly guarantee (29 CFR 778.111(b)) the week pays the
            larger of that and the guarantee × hours clocked on jobs.
          </dd>
          <dt className={styles.term}>Hourly pay</dt>
          <dd className={styles.definition}>
            Every hour worked × the hourly rate, for technicians paid hourly.
          </dd>
          <dt className={styles.term}>Rest periods</dt>
          <dd className={styles.definition}>
            Paid rest breaks. Under California rules, rest periods authorized but not punched are credited (10
            minutes per 4 hours or major fraction, IWC wage orders §12) and paid at the week’s average hourly
            rate (Labor Code 226.2); otherwise they are paid at the hourly rate when the shop pays other time.
          </dd>
          <dt className={styles.term}>Other non-productive time</dt>
          <dd className={styles.definition}>
            Hours at work while clocked on no job (waiting, shop time) × the hourly rate, when the shop pays
            that time separately (Shop settings), or under the guarantee; at least the minimum wage in
            California.
          </dd>
          <dt className={styles.term}>Hours worked</dt>
          <dd className={styles.definition}>
            Shift time less bona fide meal breaks; paid rest breaks count, and so does a “meal” shorter than
            the shop’s minimum (29 CFR 785.18–785.19).
          </dd>
          <dt className={styles.term}>Regular rate</dt>
          <dd className={styles.definition}>
            Straight-time pay, plus any minimum-wage top-up, ÷ all hours worked in the week (29 CFR 778.111).
          </dd>
          <dt className={styles.term}>Overtime premium</dt>
          <dd className={styles.definition}>
            Half the regular rate for each overtime hour (the straight-time pay already covers the hour
            itself), the whole regular rate again for each double-time hour.
          </dd>
          <dt className={styles.term}>Meal premiums</dt>
          <dd className={styles.definition}>
            California only: an estimated hour at the regular rate for each workday whose punches show a
            missed, late or short meal (Labor Code 512 and 226.7).
          </dd>
          <dt className={styles.term}>Earlier weeks</dt>
          <dd className={styles.definition}>
            Additional overtime owed for earlier weeks on flat-rate pay finished this week, and adjustments
            for closed weeks whose lines changed after they were closed; open Details on a technician for each
            one.
          </dd>
          <dt className={styles.term}>Payable this week</dt>
          <dd className={styles.definition}>
            The week total plus the earlier-week amounts. An adjustment for an overpaid closed week can take
            it below the minimum wage for the hours worked, or below zero: the row then says so. The figure is
            not changed; confirm with payroll before paying, since deductions may not cut pay below the
            minimum wage (29 CFR 531.35).
          </dd>
        </dl>
      </ReportSection>
    </div>
  );
}
