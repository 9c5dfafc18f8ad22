import { StreamableFile } from '@nestjs/common';
import { stringify } from 'csv-stringify/sync';
import type { PayReport, PayReportTechnician } from '@baytime/shared';

/**
 * The payroll export's columns: their names and order never change, so a payroll provider's import
 * can be set up once (the README documents each). Hours to 2 decimals, money in dollars and cents.
 */
export const PAYROLL_COLUMNS = [
  'employee_id',
  'regular_hours',
  'overtime_hours',
  'double_time_hours',
  'flagged_pay',
  'non_productive_pay',
  'rest_pay',
  'premiums',
  'adjustments',
] as const;

const hours = (value: number) => value.toFixed(2);
const dollars = (cents: number) => (cents / 100).toFixed(2);

/**
 * One technician's row from the week's pay report. Overtime hours in the report count time-and-a-half
 * and double time together; here each has its own column, and regular hours are the rest of the hours
 * worked. Premiums are what the overtime rules and the minimum-wage floor add to piece-rate pay, so the
 * money columns add up to the report's total. Rest pay and adjustments have no figure in the pay report
 * yet: they are 0 until the report carries them.
 */
export function payrollRow(
  technician: PayReportTechnician,
): Record<(typeof PAYROLL_COLUMNS)[number], string> {
  const timeAndAHalf = technician.overtimeHours - technician.doubleTimeHours;
  return {
    employee_id: String(technician.technicianId),
    regular_hours: hours(technician.hoursWorked - technician.overtimeHours),
    overtime_hours: hours(timeAndAHalf),
    double_time_hours: hours(technician.doubleTimeHours),
    flagged_pay: dollars(technician.flaggedPayCents),
    non_productive_pay: dollars(technician.nonProductivePayCents),
    rest_pay: dollars(0),
    premiums: dollars(technician.overtimePremiumCents + technician.minimumWageTopUpCents),
    adjustments: dollars(0),
  };
}

/** The closed pay week as the payroll provider reads it: a header, then one row per technician. */
export function payrollCsv(report: PayReport): StreamableFile {
  const body = stringify(report.technicians.map(payrollRow), { header: true, columns: [...PAYROLL_COLUMNS] });
  return new StreamableFile(Buffer.from(body, 'utf8'), {
    type: 'text/csv; charset=utf-8',
    disposition: `attachment; filename="baytime-payroll-${report.week}.csv"`,
  });
}
