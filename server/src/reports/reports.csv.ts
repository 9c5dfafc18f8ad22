import { StreamableFile } from '@nestjs/common';
import { stringify } from 'csv-stringify/sync';
import {
  HOURS_ROUNDING_RULE,
  PAY_TYPE_WORDS,
  type LabourReport,
  type LabourReportRow,
  type PayReport,
  type PayReportTechnician,
  type PayReportTotals,
} from '@baytime/shared';

type Cell = string;
type Column<T> = [header: string, value: (row: T) => Cell];

/** Hours to 4 decimals: the pay is worked out from whole seconds, and 4 decimals reconcile with the cents. */
const hours = (value: number): Cell => value.toFixed(4);
const percent = (value: number | null): Cell => (value === null ? '' : (value * 100).toFixed(2));
const dollars = (cents: number): Cell => (cents / 100).toFixed(2);
const yesNo = (value: boolean): Cell => (value ? 'yes' : 'no');
/** A name a spreadsheet would read as a formula is kept as text (OWASP "CSV injection"). */
const text = (value: string): Cell => (/^[=+\-@\t\r]/.test(value) ? `'${value}` : value);

function csvFile<T>(
  kind: 'labour' | 'pay',
  week: string,
  columns: Column<T>[],
  rows: T[],
  notes: Cell[][] = [],
): StreamableFile {
  // A byte-order mark, so spreadsheet programs read the names as UTF-8.
  const body = stringify(
    [
      columns.map(([header]) => header),
      ...rows.map((row) => columns.map(([, value]) => value(row))),
      ...notes,
    ],
    { bom: true },
  );
  return new StreamableFile(Buffer.from(body, 'utf8'), {
    type: 'text/csv; charset=utf-8',
    disposition: `attachment; filename="baytime-${kind}-${week}.csv"`,
  });
}

type LabourCsvRow = LabourReportRow & { name: string; weekName: string };

const LABOUR_COLUMNS: Column<LabourCsvRow>[] = [
  ['Week', (row) => row.weekName],
  ['Technician', (row) => text(row.name)],
  ['Attendance hours', (row) => hours(row.attendanceHours)],
  ['Clocked hours', (row) => hours(row.clockedHours)],
  ['Flagged hours', (row) => hours(row.flaggedHours)],
  ['Clocked on finished lines (any week)', (row) => hours(row.matchedClockedHours)],
  ['Work in progress hours', (row) => hours(row.workInProgressHours)],
  ['Productivity %', (row) => percent(row.productivity)],
  ['Efficiency %', (row) => percent(row.efficiency)],
  ['Proficiency %', (row) => percent(row.proficiency)],
];

/** One row per technician, one for the shop, then the rounding rule; ratios in percent. */
export function labourCsv(report: LabourReport): StreamableFile {
  const rows = [...report.technicians, { ...report.shop, name: 'Shop total' }];
  return csvFile(
    'labour',
    report.week,
    LABOUR_COLUMNS,
    rows.map((row) => ({ ...row, weekName: report.weekName })),
    [['Rounding', HOURS_ROUNDING_RULE]],
  );
}

/** A technician's row, or the totals row (null: the figure has no total). */
type PayCsvRow = { weekName: string; status: string } & (
  { tech: PayReportTechnician; totals: null } | { tech: null; totals: PayReportTotals }
);
type Figure = keyof PayReportTotals & keyof PayReportTechnician;

const own =
  (format: (tech: PayReportTechnician) => Cell) =>
  (row: PayCsvRow): Cell =>
    row.tech ? format(row.tech) : '';
const summed =
  (figure: Figure, format: (value: number) => Cell) =>
  (row: PayCsvRow): Cell =>
    format((row.tech ?? row.totals!)[figure]);

const PAY_COLUMNS: Column<PayCsvRow>[] = [
  ['Week', (row) => row.weekName],
  ['Week status', (row) => row.status],
  ['Technician', (row) => (row.tech ? text(row.tech.name) : 'Total')],
  ['Pay type', own((tech) => PAY_TYPE_WORDS[tech.payType])],
  ['Rates from', own((tech) => tech.rateFrom)],
  ['Flat rate $/h', own((tech) => dollars(tech.flatRateCents))],
  ['Hourly rate $/h', own((tech) => dollars(tech.hourlyRateCents))],
  ['Guarantee $/h', own((tech) => dollars(tech.guaranteeCents))],
  ['Overtime exempt', own((tech) => yesNo(tech.overtimeExempt))],
  ['Flagged hours', summed('flaggedHours', hours)],
  ['Hours worked', summed('hoursWorked', hours)],
  ['Rest hours', summed('restHours', hours)],
  ['Rest rate $/h', own((tech) => (tech.restRateCents === null ? '' : dollars(tech.restRateCents)))],
  ['Rest pay $', summed('restPayCents', dollars)],
  ['Other non-productive hours', summed('otherNonProductiveHours', hours)],
  ['Other non-productive pay $', summed('otherNonProductivePayCents', dollars)],
  ['Flagged pay $', summed('flaggedPayCents', dollars)],
  ['Guarantee top-up $', summed('guaranteeTopUpCents', dollars)],
  ['Hourly pay $', summed('hourlyPayCents', dollars)],
  ['Straight-time pay $', summed('straightTimeCents', dollars)],
  ['Regular rate $/h', own((tech) => dollars(tech.regularRateCents))],
  ['Overtime hours', summed('overtimeHours', hours)],
  ['Double-time hours', summed('doubleTimeHours', hours)],
  ['Overtime premium $', summed('overtimePremiumCents', dollars)],
  ['Minimum wage top-up $', summed('minimumWageTopUpCents', dollars)],
  ['Meal premiums $', summed('mealPremiumCents', dollars)],
  ['Week total $', summed('totalCents', dollars)],
  ['Additional overtime for earlier weeks $', summed('additionalOvertimeCents', dollars)],
  ['Adjustments for closed weeks $', summed('adjustmentCents', dollars)],
  ['Payable this week $', summed('payableCents', dollars)],
  ['Unresolved exceptions', own((tech) => String(tech.unresolvedExceptions))],
  ['Under minimum wage', own((tech) => yesNo(tech.underMinimumWage))],
  ['Near overtime', own((tech) => yesNo(tech.nearOvertime))],
  ['Caution', own((tech) => tech.payableCaution ?? '')],
];

/** Whether the week is closed, and whether exceptions wait: the CSV says it on every row. */
export function weekStatus(report: PayReport): string {
  const state = report.closed ? 'closed' : 'open';
  return report.unresolvedExceptions > 0
    ? `${state}: ${report.unresolvedExceptions} unresolved exception(s), figures not final`
    : state;
}

/** One row per technician, a total row, then the estimate caution and the rounding rule. */
export function payCsv(report: PayReport): StreamableFile {
  const shared = { weekName: report.weekName, status: weekStatus(report) };
  return csvFile(
    'pay',
    report.week,
    PAY_COLUMNS,
    [
      ...report.technicians.map((tech): PayCsvRow => ({ ...shared, tech, totals: null })),
      { ...shared, tech: null, totals: report.totals },
    ],
    [
      ['Estimate', report.caution],
      ['Rounding', report.rounding],
    ],
  );
}
