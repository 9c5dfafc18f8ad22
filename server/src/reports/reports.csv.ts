import { StreamableFile } from '@nestjs/common';
import { stringify } from 'csv-stringify/sync';
import type { LabourReport, LabourReportRow, PayReport, PayReportTechnician } from '@baytime/shared';

type Cell = string;
type Column<T> = [header: string, value: (row: T) => Cell];

const hours = (value: number): Cell => value.toFixed(2);
const percent = (value: number | null): Cell => (value === null ? '' : (value * 100).toFixed(2));
const dollars = (cents: number): Cell => (cents / 100).toFixed(2);
const yesNo = (value: boolean): Cell => (value ? 'yes' : 'no');
/** A name a spreadsheet would read as a formula is kept as text (OWASP "CSV injection"). */
const text = (value: string): Cell => (/^[=+\-@\t\r]/.test(value) ? `'${value}` : value);

function csvFile<T>(kind: 'labour' | 'pay', week: string, columns: Column<T>[], rows: T[]): StreamableFile {
  // A byte-order mark, so spreadsheet programs read the names as UTF-8.
  const body = stringify(
    [columns.map(([header]) => header), ...rows.map((row) => columns.map(([, value]) => value(row)))],
    { bom: true },
  );
  return new StreamableFile(Buffer.from(body, 'utf8'), {
    type: 'text/csv; charset=utf-8',
    disposition: `attachment; filename="baytime-${kind}-${week}.csv"`,
  });
}

type LabourCsvRow = LabourReportRow & { name: string };

const LABOUR_COLUMNS: Column<LabourCsvRow>[] = [
  ['Technician', (row) => text(row.name)],
  ['Attendance hours', (row) => hours(row.attendanceHours)],
  ['Clocked hours', (row) => hours(row.clockedHours)],
  ['Flagged hours', (row) => hours(row.flaggedHours)],
  ['Productivity %', (row) => percent(row.productivity)],
  ['Efficiency %', (row) => percent(row.efficiency)],
  ['Proficiency %', (row) => percent(row.proficiency)],
];

/** One row per technician and a last one for the shop; hours to 2 decimals, ratios in percent. */
export function labourCsv(report: LabourReport): StreamableFile {
  return csvFile('labour', report.week, LABOUR_COLUMNS, [
    ...report.technicians,
    { ...report.shop, name: 'Shop total' },
  ]);
}

type NullableInTotals =
  | 'flatRateCents'
  | 'hourlyRateCents'
  | 'regularRateCents'
  | 'overtimeExempt'
  | 'underMinimumWage'
  | 'nearOvertime';
type PayCsvRow = Omit<PayReportTechnician, 'technicianId' | NullableInTotals> & {
  flatRateCents: number | null;
  hourlyRateCents: number | null;
  regularRateCents: number | null;
  overtimeExempt: boolean | null;
  underMinimumWage: boolean | null;
  nearOvertime: boolean | null;
};

const maybe =
  <T>(format: (value: T) => Cell) =>
  (value: T | null): Cell =>
    value === null ? '' : format(value);

const PAY_COLUMNS: Column<PayCsvRow>[] = [
  ['Technician', (row) => text(row.name)],
  ['Flat rate $/h', (row) => maybe(dollars)(row.flatRateCents)],
  ['Hourly rate $/h', (row) => maybe(dollars)(row.hourlyRateCents)],
  ['Overtime exempt', (row) => maybe(yesNo)(row.overtimeExempt)],
  ['Flagged hours', (row) => hours(row.flaggedHours)],
  ['Hours worked', (row) => hours(row.hoursWorked)],
  ['Flagged pay $', (row) => dollars(row.flaggedPayCents)],
  ['Non-productive pay $', (row) => dollars(row.nonProductivePayCents)],
  ['Straight-time pay $', (row) => dollars(row.straightTimeCents)],
  ['Regular rate $/h', (row) => maybe(dollars)(row.regularRateCents)],
  ['Overtime hours', (row) => hours(row.overtimeHours)],
  ['Overtime premium $', (row) => dollars(row.overtimePremiumCents)],
  ['Minimum wage top-up $', (row) => dollars(row.minimumWageTopUpCents)],
  ['Total $', (row) => dollars(row.totalCents)],
  ['Under minimum wage', (row) => maybe(yesNo)(row.underMinimumWage)],
  ['Near overtime', (row) => maybe(yesNo)(row.nearOvertime)],
];

/** One row per technician and a last one with the totals; money in dollars to 2 decimals. */
export function payCsv(report: PayReport): StreamableFile {
  return csvFile('pay', report.week, PAY_COLUMNS, [
    ...report.technicians,
    {
      ...report.totals,
      name: 'Total',
      flatRateCents: null,
      hourlyRateCents: null,
      regularRateCents: null,
      overtimeExempt: null,
      underMinimumWage: null,
      nearOvertime: null,
    },
  ]);
}
