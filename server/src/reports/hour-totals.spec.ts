import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import {
  addIsoWeeks,
  shopLocalInstant,
  workweekDays,
  workweekOf,
  type DatedPayRules,
  type LabourReport,
  type PayReport,
  type ShopDay,
  type ShopSettings,
} from '@baytime/shared';
import { shopHistory, type ShopHistory } from '../test-support/shop-history.js';
import { weekdaysOf } from '../test-support/one-week.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ReportsService } from './reports.service.js';

/**
 * Hours with odd seconds, added up. Three technicians, each on shift and clocked on one line of their own for
 * a single stretch, in a week before the demo shop's punches (times shop-local):
 *   Ava  Monday  07:00:00.0–09:04:59.5 = 2 h 4 min 59.5 s = 7,499.5 s → 7,500 whole seconds (half up, once)
 *   Ben  Monday  07:00:00.0–09:05:00.0 = 2 h 5 min        = 7,500 s
 *   Cy   Tuesday 07:00:00.0–09:05:00.0 = 2 h 5 min        = 7,500 s
 * Each week: 7,500 s ÷ 3,600 = 2.083 333… h, shown 2.0833. The three together: 22,500 s ÷ 3,600 = 6.25 h
 * exactly, where adding the rounded 2.0833s gives 6.2499.
 */
describe(`${ReportsService.name}: hour totals`, () => {
  let sut: TestApp;
  let owner: string;
  let history: ShopHistory;
  let shop: ShopSettings;
  let week: string;
  const ids = {} as Record<'ava' | 'ben' | 'cy', number>;

  const labour = async () =>
    (await history.as(owner).get(`/api/reports/labour?week=${week}`).expect(200)).body as LabourReport;
  const pay = async () =>
    (await history.as(owner).get(`/api/reports/pay?week=${week}`).expect(200)).body as PayReport;
  const csv = async (kind: 'labour' | 'pay') => {
    const text = (await history.as(owner).get(`/api/reports/${kind}?week=${week}&format=csv`).expect(200))
      .text;
    return parse(text.replace(/^\uFEFF/, ''), { columns: true, relax_column_count: true }) as Record<
      string,
      string
    >[];
  };

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    history = shopHistory(sut, { owner, foreman: await sut.signIn(DEMO.foreman) });
    shop = (await history.as(owner).get('/api/shop').expect(200)).body as ShopSettings;
    week = addIsoWeeks(workweekOf(new Date(), shop), -3);
    const [monday, tuesday] = weekdaysOf(week, shop) as [ShopDay, ShopDay];
    const at = (day: ShopDay, time: string, ms = 0) =>
      new Date(shopLocalInstant(day.day, time, shop.timeZone).getTime() + ms);

    ids.ava = await history.technician('Ava Quillon', '5101', 20_00, 12_00);
    ids.ben = await history.technician('Ben Ashcombe', '5102', 20_00, 12_00);
    ids.cy = await history.technician('Cy Farrant', '5103', 20_00, 12_00);
    await history.workedLine(
      ids.ava,
      'Replace brake pads',
      2.5,
      at(monday, '07:00'),
      at(monday, '09:04', 59_500),
    );
    await history.workedLine(ids.ben, 'Replace brake pads', 2.5, at(monday, '07:00'), at(monday, '09:05'));
    await history.workedLine(ids.cy, 'Replace brake pads', 2.5, at(tuesday, '07:00'), at(tuesday, '09:05'));
  }, 120_000);
  afterAll(() => sut.close());

  it('shows the same attendance on the labour report as hours worked on the pay summary', async () => {
    const [labourReport, payReport] = [await labour(), await pay()];
    for (const id of Object.values(ids)) {
      const row = labourReport.technicians.find((tech) => tech.technicianId === id)!;
      const payRow = payReport.technicians.find((tech) => tech.technicianId === id)!;
      expect(row.attendanceHours, `technician ${id}`).toBe(payRow.hoursWorked);
      expect(row.clockedHours, `technician ${id}`).toBe(2.0833);
    }
    // Ava's 7,499.5 s are 7,500 whole seconds on both: 2.0833 h, never 2.0832 on one and 2.0833 on the other.
    const ava = labourReport.technicians.find((tech) => tech.technicianId === ids.ava)!;
    expect(ava.attendanceHours).toBe(2.0833);
  });

  it('totals hours from the seconds, rounded once: 6.25 h, not 6.2499', async () => {
    const [labourReport, payReport] = [await labour(), await pay()];
    expect(payReport.totals.hoursWorked).toBe(6.25);
    // 3 × 2.5 book hours flagged; 2.5 h = 9,000 s each.
    expect(payReport.totals.flaggedHours).toBe(7.5);
    expect(labourReport.shop).toMatchObject({ attendanceHours: 6.25, clockedHours: 6.25, flaggedHours: 7.5 });
    // 7.5 ÷ 6.25 = 1.2, for both efficiency (matched on the same lines) and proficiency; productivity 1.
    expect(labourReport.shop).toMatchObject({ productivity: 1, efficiency: 1.2, proficiency: 1.2 });
    const ava = labourReport.technicians.find((tech) => tech.technicianId === ids.ava)!;
    expect(ava.lineTotals).toEqual({ bookHours: 2.5, flaggedHours: 2.5, clockedHours: 2.0833 });
  });

  it('writes the same totals in the CSV files', async () => {
    const payTotal = (await csv('pay')).find((row) => row['Technician'] === 'Total')!;
    expect(payTotal['Hours worked']).toBe('6.2500');
    expect(payTotal['Flagged hours']).toBe('7.5000');
    const shopRow = (await csv('labour')).find((row) => row['Technician'] === 'Shop total')!;
    expect(shopRow['Attendance hours']).toBe('6.2500');
    expect(shopRow['Clocked hours']).toBe('6.2500');
  });

  // California Labor Code 510(a): 1.5× over 40 h in the workweek (no day here reaches the daily 8 h, and six
  // days are not seven). Dee, hourly, is on shift six days running, 07:00:00.0–13:40:00.5 = 6 h 40 min 0.5 s =
  // 24,000.5 s a day, never on a job: 144,003 s in the week, 3 s over 40 h → 0.0008 h overtime (3 ÷ 3,600 =
  // 0.000 83), hours worked 144,003 ÷ 3,600 = 40.000 83 → 40.0008. Days rounded one by one would count
  // 6 × 24,001 = 144,006 s, 6 s of overtime against 3 s of hours worked over 40.
  it('counts the days of a California week so they add up to its hours worked', async () => {
    const earlier = addIsoWeeks(week, -1);
    const days = workweekDays(earlier, shop).slice(0, 6);
    const dee = await history.technician('Dee Marchetti', '5104', 0, 20_00);
    for (const day of days) {
      await history.punch(dee, 'shift-in', shopLocalInstant(day.day, '07:00', shop.timeZone));
      const out = shopLocalInstant(day.day, '13:40', shop.timeZone).getTime() + 500;
      await history.punch(dee, 'shift-out', new Date(out));
    }
    const payRulesFrom = days[0]!.day;
    await history
      .as(owner)
      .patch('/api/shop', { overtimeRules: 'california', minimumWageCents: 16_50, payRulesFrom })
      .expect(200);
    try {
      const rules = (await history.as(owner).get('/api/shop/pay-rules').expect(200)).body as DatedPayRules[];
      expect(rules.at(-1)).toMatchObject({ effectiveFrom: payRulesFrom, overtimeRules: 'california' });
      const report = (await history.as(owner).get(`/api/reports/pay?week=${earlier}`).expect(200))
        .body as PayReport;
      expect(report.technicians.find((row) => row.technicianId === dee)).toMatchObject({
        hoursWorked: 40.0008,
        overtimeHours: 0.0008,
        doubleTimeHours: 0,
      });
      const labourReport = (await history.as(owner).get(`/api/reports/labour?week=${earlier}`).expect(200))
        .body as LabourReport;
      expect(labourReport.technicians.find((row) => row.technicianId === dee)!.attendanceHours).toBe(40.0008);
    } finally {
      await history
        .as(owner)
        .patch('/api/shop', { overtimeRules: 'federal', minimumWageCents: 7_25, payRulesFrom })
        .expect(200);
    }
  });
});
