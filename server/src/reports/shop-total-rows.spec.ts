import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { parse } from 'csv-parse/sync';
import {
  addIsoWeeks,
  HOURS_ROUNDING_RULE,
  shopLocalInstant,
  workweekOf,
  type LabourReport,
  type LabourReportRow,
  type PayReport,
  type ShopDay,
  type ShopSettings,
} from '@baytime/shared';
import { shopHistory, type ShopHistory } from '../test-support/shop-history.js';
import { weekdaysOf } from '../test-support/one-week.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ReportsService } from './reports.service.js';

const HOUR_COLUMNS = [
  'attendanceHours',
  'clockedHours',
  'flaggedHours',
  'matchedClockedHours',
  'workInProgressHours',
] as const satisfies readonly (keyof LabourReportRow)[];

/**
 * The shop row is the sum of the rows shown. Two technicians in a week before the demo shop's punches (times
 * shop-local), each on shift from the first job-on to the last job-off:
 *   Fay  Monday  07:00–08:30 line A (book 1.5, finished 08:30), 08:30–09:12 line B (book 3.0, not finished)
 *        attendance = clocked = 2 h 12 min = 2.2 h; flagged 1.5; matched 1.5 (A's 90 min); WIP 42 min = 0.7 h
 *   Gus  Tuesday 07:00–08:48 line C (book 2.0, finished 08:48), 08:48–09:00 line D (book 1.0, not finished)
 *        attendance = clocked = 2.0 h; flagged 2.0; matched 1 h 48 min = 1.8 h; WIP 12 min = 0.2 h
 * Then Gus is made foreman. The week he worked as a technician still lists him; the shop row adds both:
 *   attendance 2.2 + 2.0 = 4.2, clocked 4.2, flagged 1.5 + 2.0 = 3.5, matched 1.5 + 1.8 = 3.3, WIP 0.7 + 0.2 = 0.9.
 * Left out, his row went while the trend still counted his hours (0.9 h of work in progress against the shop
 * row's 0.7), and the pay summary dropped the 2 h he worked.
 */
describe(`${ReportsService.name}: the shop row adds up the rows`, () => {
  let sut: TestApp;
  let owner: string;
  let history: ShopHistory;
  let shop: ShopSettings;
  let week: string;
  const ids = {} as Record<'fay' | 'gus', number>;

  const labour = async (query: string) =>
    (await history.as(owner).get(`/api/reports/labour?${query}`).expect(200)).body as LabourReport;
  const row = (report: LabourReport, id: number) =>
    report.technicians.find((tech) => tech.technicianId === id);

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    history = shopHistory(sut, { owner, foreman: await sut.signIn(DEMO.foreman) });
    shop = (await history.as(owner).get('/api/shop').expect(200)).body as ShopSettings;
    week = addIsoWeeks(workweekOf(new Date(), shop), -3);
    const [monday, tuesday] = weekdaysOf(week, shop) as [ShopDay, ShopDay];
    const at = (day: ShopDay, time: string) => shopLocalInstant(day.day, time, shop.timeZone);

    ids.fay = await history.technician('Fay Lindgren', '5301', 20_00, 12_00);
    ids.gus = await history.technician('Gus Harrow', '5302', 20_00, 12_00);
    const twoLines = async (
      technicianId: number,
      day: ShopDay,
      [first, firstBook]: [string, number],
      [second, secondBook]: [string, number],
      [start, change, end]: [string, string, string],
    ) => {
      const queued = new Date(at(day, start).getTime() - 30 * 60_000);
      const finished = history.line(first, firstBook, technicianId, queued);
      const open = history.line(second, secondBook, technicianId, queued);
      await history.punch(technicianId, 'shift-in', at(day, start));
      await history.punch(technicianId, 'job-on', at(day, start), finished);
      await history.punch(technicianId, 'job-off', at(day, change), finished);
      await history.punch(technicianId, 'job-on', at(day, change), open);
      await history.punch(technicianId, 'job-off', at(day, end), open);
      await history.punch(technicianId, 'shift-out', at(day, end));
      await history.finish(finished, at(day, change));
    };
    await twoLines(
      ids.fay,
      monday,
      ['Replace brake pads', 1.5],
      ['Replace clutch', 3],
      ['07:00', '08:30', '09:12'],
    );
    await twoLines(
      ids.gus,
      tuesday,
      ['Replace water pump', 2],
      ['Diagnose misfire', 1],
      ['07:00', '08:48', '09:00'],
    );
    await history
      .as(owner)
      .patch(`/api/users/${ids.gus}`, {
        role: 'foreman',
        email: 'gus.harrow@marlowcreek.test',
        password: 'Gus-harrow-foreman-7',
      })
      .expect(200);
  }, 120_000);
  afterAll(() => sut.close());

  it('keeps a technician made foreman on the weeks he worked, and counts him in the shop row', async () => {
    const report = await labour(`week=${week}`);
    expect(row(report, ids.fay)).toMatchObject({
      attendanceHours: 2.2,
      clockedHours: 2.2,
      flaggedHours: 1.5,
      matchedClockedHours: 1.5,
      workInProgressHours: 0.7,
    });
    expect(row(report, ids.gus)).toMatchObject({
      name: 'Gus Harrow',
      attendanceHours: 2,
      clockedHours: 2,
      flaggedHours: 2,
      matchedClockedHours: 1.8,
      workInProgressHours: 0.2,
    });
    // The demo's technicians have no hours this week: the shop row is Fay's and Gus's.
    expect(report.shop).toMatchObject({
      attendanceHours: 4.2,
      clockedHours: 4.2,
      flaggedHours: 3.5,
      matchedClockedHours: 3.3,
      workInProgressHours: 0.9,
    });
    // The trend's point for the week is the same figure as the shop row.
    expect(report.trend.at(-1)).toMatchObject({ week, ...pick(report.shop) });
  });

  it('pays him for the hours he worked as a technician', async () => {
    const pay = (await history.as(owner).get(`/api/reports/pay?week=${week}`).expect(200)).body as PayReport;
    expect(pay.technicians.find((tech) => tech.technicianId === ids.gus)).toMatchObject({
      hoursWorked: 2,
      flaggedHours: 2,
    });
    expect(pay.totals).toMatchObject({ hoursWorked: 4.2, flaggedHours: 3.5 });
  });

  it('leaves him off the weeks he did not work', async () => {
    const later = await labour(`week=${addIsoWeeks(week, 1)}`);
    // The demo shop's six technicians (on the books for 30 days); Fay and Gus were added today.
    expect(later.technicians).toHaveLength(6);
    expect(row(later, ids.gus)).toBeUndefined();
  });

  it('shows the running week with a shop row that adds up the rows, and the trend agreeing', async () => {
    const report = await labour('');
    for (const column of HOUR_COLUMNS) {
      const rows = report.technicians.reduce((sum, tech) => sum + tech[column], 0);
      // Each row and the total are rounded once to 4 decimals: at most half of 0.0001 h a row apart.
      expect(Math.abs(rows - report.shop[column]), column).toBeLessThanOrEqual(
        0.00005 * report.technicians.length + 1e-9,
      );
    }
    expect(report.trend.at(-1)).toMatchObject(pick(report.shop));
  });

  it('states the rounding rule under the shop total in the CSV', async () => {
    const text = (await history.as(owner).get(`/api/reports/labour?week=${week}&format=csv`).expect(200))
      .text;
    const rows = parse(text.replace(/^\uFEFF/, ''), { relax_column_count: true }) as string[][];
    expect(rows.at(-2)?.[1]).toBe('Shop total');
    expect(rows.at(-2)?.[6]).toBe('0.9000');
    expect(rows.at(-1)).toEqual(['Rounding', HOURS_ROUNDING_RULE]);
  });
});

const pick = (row: LabourReportRow) =>
  Object.fromEntries(HOUR_COLUMNS.map((column) => [column, row[column]]));
