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
 * One technician's row from the week's pay report, with the report's very figures. Overtime hours in the report
 * count time-and-a-half and double time together; here each has its own column, and regular hours are the rest
 * of the hours worked. The money columns add up to what the report says is payable this week:
 * - flagged pay is the flat-rate pay with any hourly-guarantee top-up (29 CFR 778.111(b)), or for a technician
 *   paid hourly, the hourly pay: the straight-time pay for the work itself;
 * - non-productive pay is the other time off jobs, and rest pay the rest periods (California Labor Code 226.2
 *   asks for them apart), never counted in both;
 * - premiums are the overtime premium, the minimum-wage top-up, meal premiums and the additional overtime owed
 *   for earlier weeks (29 CFR 778.119);
 * - adjustments are the differences owed for closed weeks that changed after closing (negative when a closed
 *   week was overpaid).
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
    flagged_pay: dollars(
      technician.flaggedPayCents + technician.guaranteeTopUpCents + technician.hourlyPayCents,
    ),
    non_productive_pay: dollars(technician.otherNonProductivePayCents),
    rest_pay: dollars(technician.restPayCents),
    premiums: dollars(
      technician.overtimePremiumCents +
        technician.minimumWageTopUpCents +
        technician.mealPremiumCents +
        technician.additionalOvertimeCents,
    ),
    adjustments: dollars(technician.adjustmentCents),
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
