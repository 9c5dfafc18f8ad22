import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addIsoWeeks,
  shopLocalInstant,
  workweekDays,
  workweekOf,
  type CreatedIntegrationKey,
  type PayReport,
  type PayReportTechnician,
  type ShopSettings,
} from '@baytime/shared';
import { shopHistory } from '../test-support/shop-history.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { PAYROLL_COLUMNS, payrollRow } from './payroll-csv.js';

/** Figures shaped like the pay report's; the mapping is checked, not the pay rules. */
const technician: PayReportTechnician = {
  technicianId: 17,
  name: 'Dana Whitcombe',
  payType: 'flat-rate-guarantee',
  flatRateCents: 2800,
  hourlyRateCents: 1200,
  guaranteeCents: 1500,
  overtimeExempt: false,
  rateFrom: '2000-01-01',
  flaggedHours: 46,
  flaggedPayCents: 128_800,
  guaranteeTopUpCents: 1_000,
  hourlyPayCents: 0,
  restHours: 1,
  restRateCents: null,
  restPayCents: 1_200,
  otherNonProductiveHours: 2.5,
  otherNonProductivePayCents: 3_000,
  nonProductivePayCents: 4_200,
  straightTimeCents: 134_000,
  hoursWorked: 52.5,
  regularRateCents: 2552,
  overtimeHours: 12.5,
  doubleTimeHours: 2,
  overtimePremiumCents: 18_365,
  minimumWageTopUpCents: 135,
  mealPremiumDays: 1,
  mealPremiumCents: 2_552,
  totalCents: 155_052,
  additionalOvertime: [{ forWeek: '2026-W46', forWeekName: 'Week of Sun, Nov 15', cents: 1_045 }],
  additionalOvertimeCents: 1_045,
  adjustments: [
    {
      technicianId: 17,
      forWeek: '2026-W47',
      forWeekName: 'Week of Sun, Nov 22',
      flaggedHours: -3,
      cents: -7_500,
    },
  ],
  adjustmentCents: -7_500,
  payableCents: 148_597,
  underMinimumWage: false,
  payableCaution: null,
  nearOvertime: false,
  exceptions: [],
  unresolvedExceptions: 0,
};

const MONEY = ['flagged_pay', 'non_productive_pay', 'rest_pay', 'premiums', 'adjustments'] as const;
const centsOf = (row: Record<string, string>) =>
  MONEY.reduce((sum, column) => sum + Math.round(Number(row[column]) * 100), 0);

describe(payrollRow.name, () => {
  it('splits the hours into regular, time-and-a-half and double time', () => {
    expect(payrollRow(technician)).toMatchObject({
      employee_id: '17',
      regular_hours: '40.00',
      overtime_hours: '10.50',
      double_time_hours: '2.00',
    });
  });

  it('puts the money in columns that add up to what the report says is payable', () => {
    const row = payrollRow(technician);
    expect(row).toMatchObject({
      // $1,288.00 flagged + $10.00 guarantee top-up
      flagged_pay: '1298.00',
      // other non-productive time alone: rest pay has its own column
      non_productive_pay: '30.00',
      rest_pay: '12.00',
      // $183.65 overtime + $1.35 minimum-wage top-up + $25.52 meal premium + $10.45 additional overtime
      premiums: '220.97',
      adjustments: '-75.00',
    });
    expect(centsOf(row)).toBe(technician.payableCents);
  });

  it("puts an hourly technician's pay in flagged_pay, so the row still adds up", () => {
    const hourly: PayReportTechnician = {
      ...technician,
      payType: 'hourly',
      flaggedPayCents: 0,
      guaranteeTopUpCents: 0,
      hourlyPayCents: 63_000,
      restPayCents: 0,
      otherNonProductivePayCents: 0,
      nonProductivePayCents: 0,
      straightTimeCents: 63_000,
      overtimePremiumCents: 0,
      minimumWageTopUpCents: 0,
      mealPremiumCents: 0,
      totalCents: 63_000,
      additionalOvertime: [],
      additionalOvertimeCents: 0,
      adjustments: [],
      adjustmentCents: 0,
      payableCents: 63_000,
    };
    expect(payrollRow(hourly)).toMatchObject({ flagged_pay: '630.00', premiums: '0.00' });
    expect(centsOf(payrollRow(hourly))).toBe(63_000);
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

  it('answers the stable columns of a closed week, a row per technician of its pay report, to the owner and a reports key', async () => {
    const shop = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
      .body as ShopSettings;
    const running = workweekOf(new Date(), shop);
    const refused = await sut
      .http()
      .get(`/api/pay-weeks/${running}/payroll.csv`)
      .auth(owner, { type: 'bearer' })
      .expect(409);
    expect(refused.body.message).toMatch(/^The week of .* is not closed for pay: close it first/);
    const week = addIsoWeeks(running, -20);
    await sut
      .http()
      .post(`/api/pay-weeks/${week}/close`)
      .auth(owner, { type: 'bearer' })
      .send({})
      .expect(200);
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

  // Odile, flat $20, other time $10 (the shop pays it separately), in weeks five (W) and four (F) back,
  // before the demo's punches; times shop-local. By hand:
  // W, Monday: on shift 08:00–12:00, clocked on a 4.0 h line all the time, finished at 12:00: 4 h × $20 = $80.00
  // (4 h × $7.25 = $29.00 is below). W is closed, then the line reopened: W would pay $0 topped up to $29.00, so
  // F carries an adjustment of $29.00 − $80.00 = −$51.00.
  // F, Monday: on shift 08:00–13:30 (5.5 h) with a rest break 10:00–10:15, on no line: rest 0.25 h × $10 = $2.50,
  // other non-productive 5.25 h × $10 = $52.50; $55.00 is above 5.5 h × $7.25 = $39.875 → $39.88. Payable this
  // week $55.00 − $51.00 = $4.00.
  it("carries the pay report's adjustments and rest pay, each in its own column, adding up to the payable amount", async () => {
    const foreman = await sut.signIn(DEMO.foreman);
    const history = shopHistory(sut, { owner, foreman });
    const shop = (await history.as(owner).get('/api/shop').expect(200)).body as ShopSettings;
    const at = (week: string, time: string) =>
      shopLocalInstant(workweekDays(week, shop)[1]!.day, time, shop.timeZone);
    const current = workweekOf(new Date(), shop);
    const [W, F] = [addIsoWeeks(current, -5), addIsoWeeks(current, -4)] as [string, string];

    const odile = await history.technician('Odile Marsh', '6101', 20_00, 10_00);
    const line = await history.workedLine(odile, 'Replace water pump', 4.0, at(W, '08:00'), at(W, '12:00'));
    await history.as(owner).post(`/api/pay-weeks/${W}/close`, {}).expect(200);
    await history.as(foreman).patch(`/api/job-lines/${line}`, { status: 'queued' }).expect(200);

    await history.punch(odile, 'shift-in', at(F, '08:00'));
    await history.punch(odile, 'break-start', at(F, '10:00'), undefined, 'rest');
    await history.punch(odile, 'break-end', at(F, '10:15'));
    await history.punch(odile, 'shift-out', at(F, '13:30'));

    const report = (await history.as(owner).get(`/api/reports/pay?week=${F}`).expect(200)).body as PayReport;
    const row = report.technicians.find((t) => t.technicianId === odile)!;
    expect(row).toMatchObject({
      restPayCents: 2_50,
      otherNonProductivePayCents: 52_50,
      totalCents: 55_00,
      adjustmentCents: -51_00,
      payableCents: 4_00,
      // $4.00 is below 5.5 h × $7.25 = $39.88: the row says so.
      payableCaution: expect.stringContaining('below the minimum wage for 5.5 h worked'),
    });

    await history.as(owner).post(`/api/pay-weeks/${F}/close`, {}).expect(200);
    const csv = await history.as(owner).get(`/api/pay-weeks/${F}/payroll.csv`).expect(200);
    const [header, ...lines] = (csv.text as string).trim().split('\n');
    const rows = lines.map((text) =>
      Object.fromEntries(header!.split(',').map((column, i) => [column, text.split(',')[i]!])),
    );
    expect(rows.find((r) => r.employee_id === String(odile))).toEqual({
      employee_id: String(odile),
      regular_hours: '5.50',
      overtime_hours: '0.00',
      double_time_hours: '0.00',
      flagged_pay: '0.00',
      non_productive_pay: '52.50',
      rest_pay: '2.50',
      premiums: '0.00',
      adjustments: '-51.00',
    });
    // Every technician's row pays what the pay report says is payable.
    expect(rows.map((r) => [Number(r.employee_id), centsOf(r)])).toEqual(
      report.technicians.map((t) => [t.technicianId, t.payableCents]),
    );
  });
});
