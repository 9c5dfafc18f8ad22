import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  isoWeekOf,
  type CreatedIntegrationKey,
  type PayReport,
  type PayReportTechnician,
} from '@baytime/shared';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { PAYROLL_COLUMNS, payrollRow } from './payroll-csv.js';

/** Figures shaped like the pay report's; the mapping is checked, not the pay rules. */
const technician: PayReportTechnician = {
  technicianId: 17,
  name: 'Dana Whitcombe',
  flatRateCents: 2800,
  hourlyRateCents: 0,
  overtimeExempt: false,
  flaggedHours: 46,
  flaggedPayCents: 128_800,
  nonProductivePayCents: 4_200,
  straightTimeCents: 133_000,
  hoursWorked: 52.5,
  regularRateCents: 2533,
  overtimeHours: 12.5,
  doubleTimeHours: 2,
  overtimePremiumCents: 18_365,
  minimumWageTopUpCents: 135,
  totalCents: 151_500,
  underMinimumWage: false,
  nearOvertime: false,
};

describe(payrollRow.name, () => {
  it('splits the hours into regular, time-and-a-half and double time', () => {
    expect(payrollRow(technician)).toMatchObject({
      employee_id: '17',
      regular_hours: '40.00',
      overtime_hours: '10.50',
      double_time_hours: '2.00',
    });
  });

  it('puts the money in columns that add up to the report total', () => {
    const row = payrollRow(technician);
    expect(row).toMatchObject({
      flagged_pay: '1288.00',
      non_productive_pay: '42.00',
      rest_pay: '0.00',
      premiums: '185.00',
      adjustments: '0.00',
    });
    const money = ['flagged_pay', 'non_productive_pay', 'rest_pay', 'premiums', 'adjustments'] as const;
    expect(money.reduce((sum, column) => sum + Math.round(Number(row[column]) * 100), 0)).toBe(
      technician.totalCents,
    );
  });
});

describe('GET /api/pay-weeks/:week/payroll.csv', () => {
  let sut: TestApp;
  let owner: string;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
  });
  afterAll(() => sut.close());

  it('answers the stable columns, a row per technician of the pay report, to the owner and a reports key', async () => {
    const week = isoWeekOf(new Date(), 'UTC');
    const report = (
      await sut.http().get(`/api/reports/pay?week=${week}`).auth(owner, { type: 'bearer' }).expect(200)
    ).body as PayReport;
    const { secret } = (
      await sut
        .http()
        .post('/api/integration-keys')
        .auth(owner, { type: 'bearer' })
        .send({ name: 'Payroll provider', scopes: ['reports:read'] })
        .expect(201)
    ).body as CreatedIntegrationKey;
    for (const token of [owner, secret]) {
      const response = await sut
        .http()
        .get(`/api/pay-weeks/${week}/payroll.csv`)
        .auth(token, { type: 'bearer' })
        .expect(200)
        .expect('content-type', 'text/csv; charset=utf-8');
      const [header, ...rows] = (response.text as string).trim().split('\n');
      expect(header).toBe(PAYROLL_COLUMNS.join(','));
      expect(rows.map((row) => row.split(',')[0])).toEqual(
        report.technicians.map((t) => String(t.technicianId)),
      );
    }
    await sut.http().get('/api/pay-weeks/2030-W99/payroll.csv').auth(owner, { type: 'bearer' }).expect(400);
  });
});
