import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import { and, eq, min } from 'drizzle-orm';
import { parse } from 'csv-parse/sync';
import {
  addIsoWeeks,
  LABOUR_TREND_WEEKS,
  shopLocalInstant,
  workweekBounds,
  workweekDays,
  workweekOf,
  type LabourReport,
  type LabourReportTechnician,
  type PayReport,
  type PunchDto,
  type ShopDay,
  type DatedPayRules,
  type ShopSettings,
  type Timecard,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog, punches, users } from '../db/schema/index.js';
import { shopHistory, type ShopHistory } from '../test-support/shop-history.js';
import { weekdaysOf } from '../test-support/one-week.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ShopService } from '../shop/shop.service.js';
import { ReportsService } from './reports.service.js';
import { labourSecondsOf, WeekFiguresService } from './week-figures.service.js';

/**
 * The week under test is three workweeks back (the demo shop's punches are in the last two), so the
 * shop figures are those of the technicians made here alone. Times are shop-local (America/Chicago).
 */
describe(ReportsService.name, () => {
  let sut: TestApp;
  let db: Db;
  let owner: string;
  let foreman: string;
  let shop: ShopSettings;
  let week: string;
  let weekdays: ShopDay[];
  const ids = {} as Record<'a' | 'b' | 'c' | 'd' | 'e' | 'f', number>;
  const lineIds = { a: [] as number[], b: [] as number[], s: 0, u: 0 };
  let bayId: number;

  let history: ShopHistory;
  const as = (token: string) => history.as(token);
  const at = (day: ShopDay, time: string) => shopLocalInstant(day.day, time, shop.timeZone);
  const technician: ShopHistory['technician'] = (...args) => history.technician(...args);
  const punch: ShopHistory['punch'] = (...args) => history.punch(...args);
  const finish: ShopHistory['finish'] = (...args) => history.finish(...args);
  const line: ShopHistory['line'] = (...args) => history.line(...args);
  const labour = async (query: string, token = owner) =>
    (await as(token).get(`/api/reports/labour?${query}`).expect(200)).body as LabourReport;
  const pay = async (query: string) =>
    (await as(owner).get(`/api/reports/pay?${query}`).expect(200)).body as PayReport;
  const rowOf = (report: LabourReport, technicianId: number) =>
    report.technicians.find((row) => row.technicianId === technicianId)!;

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    owner = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
    history = shopHistory(sut, { owner, foreman });
    shop = (await as(owner).get('/api/shop').expect(200)).body as ShopSettings;
    week = addIsoWeeks(workweekOf(new Date(), shop), -3);
    weekdays = weekdaysOf(week, shop);
    const [monday, tuesday] = weekdays as [ShopDay, ShopDay];

    ids.a = await technician('Ada Vexley', '5001', 10_00, 8_00);
    ids.b = await technician('Bram Osterly', '5002', 20_00, 15_00);
    ids.c = await technician('Cleo Harwin', '5003', 18_00, 12_00);
    ids.d = await technician('Dex Morrow', '5004', 16_00, 0);
    ids.e = await technician('Eli Stroud', '5005', 0, 25_00);
    ids.f = await technician('Fay Lindqvist', '5006', 20_00, 15_00);
    bayId = (await as(owner).post('/api/bays', { name: 'Bay 9' }).expect(201)).body.id;

    // Ada: 07:00–17:30 with a 30-minute meal = 10 h a day; clocked 07:06–11:54 (4.8 h) and 12:36–17:00
    // (4.4 h) = 9.2 h; two lines finished a day. Book hours sum to 49.1.
    const adaBook = [5.4, 4.5, 5.0, 4.9, 5.6, 4.2, 5.2, 4.6, 5.3, 4.4];
    for (const [i, day] of weekdays.entries()) {
      const [first, second] = [
        line('Replace front struts', adaBook[2 * i]!, ids.a, at(day, '06:30')),
        line('Replace water pump', adaBook[2 * i + 1]!, ids.a, at(day, '06:30')),
      ];
      lineIds.a.push(first, second);
      await punch(ids.a, 'shift-in', at(day, '07:00'));
      await punch(ids.a, 'job-on', at(day, '07:06'), first);
      await punch(ids.a, 'job-off', at(day, '11:54'), first);
      await punch(ids.a, 'break-start', at(day, '12:00'));
      await punch(ids.a, 'break-end', at(day, '12:30'));
      await punch(ids.a, 'job-on', at(day, '12:36'), second);
      await punch(ids.a, 'job-off', at(day, '17:00'), second);
      await punch(ids.a, 'shift-out', at(day, '17:30'));
      await finish(first, at(day, '11:54'));
      await finish(second, at(day, '17:00'));
    }

    // Bram: 07:30–16:00 with a 30-minute meal = 8 h a day; one 9.0 h line a day in Bay 9, clocked
    // 07:36–11:54 (4.3 h) and 12:36–15:30 (2.9 h) = 7.2 h, finished at 15:30.
    for (const day of weekdays) {
      const job = line('Replace rear wheel bearing', 9.0, ids.b, at(day, '07:00'), bayId);
      lineIds.b.push(job);
      await punch(ids.b, 'shift-in', at(day, '07:30'));
      await punch(ids.b, 'job-on', at(day, '07:36'), job);
      await punch(ids.b, 'job-off', at(day, '11:54'), job);
      await punch(ids.b, 'break-start', at(day, '12:00'));
      await punch(ids.b, 'break-end', at(day, '12:30'));
      await punch(ids.b, 'job-on', at(day, '12:36'), job);
      await punch(ids.b, 'job-off', at(day, '15:30'), job);
      await punch(ids.b, 'shift-out', at(day, '16:00'));
      await finish(job, at(day, '15:30'));
    }

    // Cleo and Dex share a 2.0 h line on Tuesday: Cleo clocked 08:06–11:06 (3 h), Dex 09:00–10:00 (1 h);
    // each is on shift 08:00–12:00 (4 h). Dex is also assigned a 0.4 h line in Bay 9 that nobody clocked
    // on, queued Monday 15:00 and finished Monday 16:30.
    lineIds.s = line('Diagnose engine warning light', 2.0, ids.c, at(tuesday, '07:00'));
    lineIds.u = line('Battery and charging system test', 0.4, ids.d, at(monday, '15:00'), bayId);
    await finish(lineIds.u, at(monday, '16:30'));
    await punch(ids.c, 'shift-in', at(tuesday, '08:00'));
    await punch(ids.d, 'shift-in', at(tuesday, '08:00'));
    await punch(ids.c, 'job-on', at(tuesday, '08:06'), lineIds.s);
    await punch(ids.d, 'job-on', at(tuesday, '09:00'), lineIds.s);
    await punch(ids.d, 'job-off', at(tuesday, '10:00'), lineIds.s);
    await punch(ids.c, 'job-off', at(tuesday, '11:06'), lineIds.s);
    await punch(ids.c, 'shift-out', at(tuesday, '12:00'));
    await punch(ids.d, 'shift-out', at(tuesday, '12:00'));
    await finish(lineIds.s, at(tuesday, '11:06'));

    // Eli, the week before: hourly only, Mon 10, Tue 8, Wed 13, Thu 8, Fri 8 = 47 h, never on a job; a
    // 30-minute meal at 11:00 each day and a second one at 17:00 on the 13-hour Wednesday (Labor Code 512).
    const before = weekdaysOf(addIsoWeeks(week, -1), shop);
    const ends = ['17:30', '15:30', '21:00', '15:30', '15:30'];
    for (const [i, day] of before.entries()) {
      await punch(ids.e, 'shift-in', at(day, '07:00'));
      for (const meal of i === 2 ? ['11:00', '17:00'] : ['11:00']) {
        await punch(ids.e, 'break-start', at(day, meal));
        await punch(ids.e, 'break-end', at(day, meal.replace(':00', ':30')));
      }
      await punch(ids.e, 'shift-out', at(day, ends[i]!));
    }
  }, 120_000);
  afterAll(() => sut.close());

  it('reports the week by hand-worked figures, with the formulas', async () => {
    const report = await labour(`week=${week}`, foreman);
    expect(report).toMatchObject({ week, timeZone: 'America/Chicago' });
    expect(report.formulas.efficiency).toMatch(
      /^Efficiency = flagged hours of the lines finished this week ÷/,
    );
    expect(report.guidelines.efficiency).toEqual({ low: 1.25, high: 1.25 });

    // Ada: 5 × 10 h = 50 h attendance, 5 × 9.2 h = 46 h clocked, 49.1 h flagged →
    // productivity 46/50 = 0.92, efficiency 49.1/46 = 1.067391, proficiency 49.1/50 = 0.982.
    const ada = rowOf(report, ids.a);
    expect(ada).toMatchObject({
      name: 'Ada Vexley',
      attendanceHours: 50,
      clockedHours: 46,
      flaggedHours: 49.1,
    });
    expect(ada.productivity).toBeCloseTo(0.92, 6);
    expect(ada.efficiency).toBeCloseTo(49.1 / 46, 6);
    expect(ada.proficiency).toBeCloseTo(0.982, 6);
    expect(ada.lines).toHaveLength(10);
    // Monday's first line: book 5.4 h, clocked 07:06–11:54 = 4.8 h → 0.6 h over the clock.
    expect(ada.lines[0]).toMatchObject({ jobLineId: lineIds.a[0], title: 'Replace front struts' });
    expect(ada.lines[0]).toMatchObject({ bookHours: 5.4, flaggedHours: 5.4, clockedHours: 4.8 });
    expect(ada.lines[0]!.overUnderHours).toBeCloseTo(0.6, 6);

    // NADA definitions via a dealer association bulletin "Measuring technician performance": available 40 h,
    // worked on jobs 36 h, flagged 45 h → 90 %, 125 %, 112.5 %. Bram: 5 × 8 h attendance, 5 × 7.2 h
    // clocked, 5 × 9.0 h flagged; every line finished in the week, so the matched basis is the 36 h.
    const bram = rowOf(report, ids.b);
    expect(bram).toMatchObject({
      attendanceHours: 40,
      clockedHours: 36,
      flaggedHours: 45,
      matchedClockedHours: 36,
      workInProgressHours: 0,
    });
    expect(bram.productivity).toBeCloseTo(0.9, 6);
    expect(bram.efficiency).toBeCloseTo(1.25, 6);
    expect(bram.proficiency).toBeCloseTo(1.125, 6);

    // The shared 2.0 h line by clocked time: Cleo 2.0 × 3/4 = 1.5 h, Dex 2.0 × 1/4 = 0.5 h. Dex's 0.4 h line
    // nobody clocked on waits for a foreman's sign-off: not flagged yet.
    const cleo = rowOf(report, ids.c);
    const dex = rowOf(report, ids.d);
    expect(cleo).toMatchObject({
      attendanceHours: 4,
      clockedHours: 3,
      flaggedHours: 1.5,
      productivity: 0.75,
    });
    expect(cleo.efficiency).toBeCloseTo(0.5, 6);
    expect(dex).toMatchObject({ attendanceHours: 4, clockedHours: 1, productivity: 0.25, flaggedHours: 0.5 });
    expect(cleo.lines).toEqual([
      expect.objectContaining({
        jobLineId: lineIds.s,
        flaggedHours: 1.5,
        clockedHours: 3,
        overUnderHours: -1.5,
      }),
    ]);
    expect(dex.lines).toEqual([
      expect.objectContaining({
        jobLineId: lineIds.s,
        flaggedHours: 0.5,
        clockedHours: 1,
        overUnderHours: -0.5,
      }),
    ]);

    // Shop: hours summed first. 50 + 40 + 4 + 4 = 98 h attendance, 46 + 36 + 3 + 1 = 86 h clocked,
    // 49.1 + 45 + 1.5 + 0.5 = 96.1 h flagged → 86/98, 96.1/86, 96.1/98.
    expect(report.shop).toMatchObject({ attendanceHours: 98, clockedHours: 86, flaggedHours: 96.1 });
    expect(report.shop.productivity).toBeCloseTo(86 / 98, 6);
    expect(report.shop.efficiency).toBeCloseTo(96.1 / 86, 6);
    expect(report.shop.proficiency).toBeCloseTo(96.1 / 98, 6);
    expect(report.weekName).toMatch(/^Week of Sun, [A-Z][a-z]{2} \d{1,2}$/);
  });

  it('bounds a report by the shop’s workweek, by the calendar', async () => {
    // The demo shop's workweek starts Sunday 00:00 in America/Chicago; its week "YYYY-Www" is the one
    // that starts in that ISO week. ISO 8601 week dates: 2025-12-29 is 2026-W01-1, so 2026-W10 runs
    // Monday 2 March to Sunday 8 March, and 2026-W44 Monday 26 October to Sunday 1 November.
    // US daylight saving time (Energy Policy Act of 2005, Pub. L. 109-58 §110: second Sunday of March,
    // first Sunday of November, at 2 a.m.) turns on 8 March and off 1 November 2026. So the workweek
    // from Sunday 8 March runs from 00:00 CST (UTC−6) to 00:00 CDT (UTC−5): 167 h; the one from
    // Sunday 1 November from 00:00 CDT to 00:00 CST: 169 h.
    expect(await labour('week=2026-W10')).toMatchObject({
      from: '2026-03-08T06:00:00.000Z',
      to: '2026-03-15T05:00:00.000Z',
    });
    expect(await labour('week=2026-W44')).toMatchObject({
      from: '2026-11-01T05:00:00.000Z',
      to: '2026-11-08T06:00:00.000Z',
    });
    // ISO 8601: 2026-12-31 is 2026-W53-4, so 2026 has 53 weeks; W53's Sunday is 3 January 2027 and
    // 2027-01-04 is 2027-W01-1.
    const lastOfTheYear = await labour('week=2026-W53');
    expect(lastOfTheYear).toMatchObject({ from: '2027-01-03T06:00:00.000Z', to: '2027-01-10T06:00:00.000Z' });
    // The 12-week trend up to 2027-W02 counts back through 2026's week 53.
    expect((await labour('week=2027-W02')).trend.map((point) => point.week)).toEqual([
      '2026-W44',
      '2026-W45',
      '2026-W46',
      '2026-W47',
      '2026-W48',
      '2026-W49',
      '2026-W50',
      '2026-W51',
      '2026-W52',
      '2026-W53',
      '2027-W01',
      '2027-W02',
    ]);
  });

  it('shows the shop trend over 12 weeks: null ratios where nothing was worked', async () => {
    const { trend, shop: totals } = await labour(`week=${week}`);
    expect(trend).toHaveLength(12);
    expect(trend[11]).toMatchObject({ week, ...totals });
    // The week before: Eli's 47 h on shift and no job → productivity 0/47 = 0, efficiency 0/0 = null.
    expect(trend[10]).toMatchObject({
      attendanceHours: 47,
      productivity: 0,
      efficiency: null,
      proficiency: 0,
    });
    expect(trend[0]).toMatchObject({ attendanceHours: 0, productivity: null, efficiency: null });
  });

  it('keeps finished weeks of the trend only until a punch changes them', async () => {
    expect((await labour(`week=${week}`)).trend[9]).toMatchObject({ attendanceHours: 0 });
    // A 2-hour shift added two weeks back shows in the next report.
    const gus = await technician('Gus Farrant', '5007', 15_00, 10_00);
    const day = workweekDays(addIsoWeeks(week, -2), shop)[2]!;
    await punch(gus, 'shift-in', at(day, '08:00'));
    await punch(gus, 'shift-out', at(day, '10:00'));
    expect((await labour(`week=${week}`)).trend[9]).toMatchObject({ attendanceHours: 2, productivity: 0 });
  });

  it('derives bay utilisation from the lines in the bay over the opening hours', async () => {
    const bay = (await labour(`week=${week}`)).bayUtilisation.find((b) => b.bayId === bayId)!;
    // Opening hours 07:30–17:30 (10 h) on weekdays, closed at the weekend. Bram's line each day runs
    // from its first job-on at 07:36 to done at 15:30 = 7.9 h → 0.79. On Monday Dex's unclocked line
    // (queued 15:00, done 16:30) joins it: 07:36–16:30 = 8.9 h → 0.89. Week: (8.9 + 4 × 7.9) / 50 = 0.81.
    expect(bay.days).toHaveLength(7);
    const share = new Map(bay.days.map((d) => [d.day, d.share]));
    expect(share.get(weekdays[0]!.day)).toBeCloseTo(0.89, 6);
    for (const day of weekdays.slice(1)) expect(share.get(day.day)).toBeCloseTo(0.79, 6);
    expect(bay.days.filter((d) => d.share === null)).toHaveLength(2);
    expect(bay.week).toBeCloseTo(0.81, 6);
  });

  // 29 CFR 778.111(a), the pieceworker example: 50 h worked; $491.00 piece pay for 46 productive hours;
  // 4 h waiting at $8.00 → straight time $523.00, regular rate $523.00 ÷ 50 = $10.46, premium
  // 10 × $5.23 = $52.30, total $575.30 (= 40 × $10.46 + 10 × $15.69). Ada's week: 49.1 flagged h × $10.00
  // = $491.00; idle 07:00–07:06, 11:54–12:00, 12:30–12:36 and 17:00–17:30 = 0.8 h a day = 4 h × $8.00.
  it('pays 29 CFR 778.111(a) vector A end to end', async () => {
    const report = await pay(`week=${week}`);
    expect(report).toMatchObject({ week, rules: 'federal', minimumWageCents: 7_25 });
    expect(report.caution).toMatch(/estimate/);
    const ada = report.technicians.find((row) => row.technicianId === ids.a)!;
    expect(ada).toEqual({
      technicianId: ids.a,
      name: 'Ada Vexley',
      payType: 'flat-rate',
      flatRateCents: 10_00,
      hourlyRateCents: 8_00,
      guaranteeCents: 0,
      overtimeExempt: false,
      rateFrom: '2000-01-01',
      flaggedHours: 49.1,
      flaggedPayCents: 491_00,
      guaranteeTopUpCents: 0,
      hourlyPayCents: 0,
      restHours: 0,
      restRateCents: null,
      restPayCents: 0,
      otherNonProductiveHours: 4,
      otherNonProductivePayCents: 32_00,
      nonProductivePayCents: 32_00,
      straightTimeCents: 523_00,
      hoursWorked: 50,
      regularRateCents: 10_46,
      overtimeHours: 10,
      doubleTimeHours: 0,
      overtimePremiumCents: 52_30,
      minimumWageTopUpCents: 0,
      mealPremiumDays: 0,
      mealPremiumCents: 0,
      totalCents: 575_30,
      additionalOvertime: [],
      additionalOvertimeCents: 0,
      adjustments: [],
      adjustmentCents: 0,
      payableCents: 575_30,
      underMinimumWage: false,
      payableCaution: null,
      nearOvertime: false,
      exceptions: [],
      unresolvedExceptions: 0,
    });
    expect(ada.totalCents).toBe(40 * 10_46 + 10 * 15_69);
  });

  // 29 USC 206(a)(1)(C): $7.25 for every hour worked, piece rate included. Dex: 0.5 flagged h × $16.00 =
  // $8.00 (his unclocked line awaits sign-off) and no pay for waiting, for 4 h worked; 4 × $7.25 = $29.00 →
  // top-up $21.00.
  it('tops up to the minimum wage and totals the week', async () => {
    const report = await pay(`week=${week}`);
    const dex = report.technicians.find((row) => row.technicianId === ids.d)!;
    expect(dex).toMatchObject({
      flaggedPayCents: 8_00,
      nonProductivePayCents: 0,
      minimumWageTopUpCents: 21_00,
      regularRateCents: 7_25,
      totalCents: 29_00,
      underMinimumWage: true,
    });
    // Bram: 45 × $20 = $900 + 4 h idle × $15 = $60 → $960, 40 h, no overtime.
    // Cleo: 1.5 × $18 = $27 + 1 h idle × $12 = $12 → $39 for 4 h, above 4 × $7.25 = $29.
    const totals = { flagged: 491_00 + 900_00 + 27_00 + 8_00, total: 575_30 + 960_00 + 39_00 + 29_00 };
    expect(report.technicians.find((row) => row.technicianId === ids.b)).toMatchObject({
      totalCents: 960_00,
    });
    expect(report.technicians.find((row) => row.technicianId === ids.c)).toMatchObject({ totalCents: 39_00 });
    expect(report.totals).toMatchObject({
      flaggedPayCents: totals.flagged,
      totalCents: totals.total,
      hoursWorked: 98,
      overtimeHours: 10,
      overtimePremiumCents: 52_30,
      minimumWageTopUpCents: 21_00,
    });
    // The unclocked line is on the week's exceptions, and the week is marked as not final.
    expect(dex.exceptions.map((e) => e.kind)).toEqual(['done-unclocked']);
    expect(report.unresolvedExceptions).toBe(1);
  });

  it('flags technicians nearing overtime while the week runs', () => {
    // On Thursday at 12:00: Ada has 3 × 10 h + 07:00–12:00 = 35 h; 34.5 of the week's 50 opening hours
    // have passed, so her pace projects 35 × 50 / 34.5 = 50.7 h ≥ 36. Cleo's 4 h project to 5.8 h.
    const thursdayNoon = at(weekdays[3]!, '12:00');
    const report = sut.app.get(ReportsService).pay(week, thursdayNoon);
    const ada = report.technicians.find((row) => row.technicianId === ids.a)!;
    expect(ada).toMatchObject({ hoursWorked: 35, nearOvertime: true });
    expect(report.technicians.find((row) => row.technicianId === ids.c)).toMatchObject({
      hoursWorked: 4,
      nearOvertime: false,
    });
    // By then 7 of Ada's lines were done (Thursday's first at 11:54): 5.4 + 4.5 + 5.0 + 4.9 + 5.6 + 4.2 + 5.2.
    expect(ada.flaggedHours).toBeCloseTo(34.8, 6);
  });

  it('exports CSV with plain headers, one row per technician and a total row', async () => {
    const labourCsv = await as(owner).get(`/api/reports/labour?week=${week}&format=csv`).expect(200);
    expect(labourCsv.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(labourCsv.headers['content-disposition']).toBe(
      `attachment; filename="baytime-labour-${week}.csv"`,
    );
    const rows = labourCsv.text
      .replace(/^\uFEFF/, '')
      .trimEnd()
      .split('\n');
    const report = await labour(`week=${week}`);
    // A header, the technicians, the shop total, and the rounding rule.
    expect(rows).toHaveLength(1 + report.technicians.length + 2);
    expect(rows[0]).toBe(
      'Week,Technician,Attendance hours,Clocked hours,Flagged hours,Clocked on finished lines (any week),' +
        'Work in progress hours,Productivity %,Efficiency %,Proficiency %',
    );
    const name = report.weekName;
    // 49.1 / 46 = 106.739 %; 49.1 / 50 = 98.2 %.
    expect(rows).toContain(`"${name}",Ada Vexley,50.0000,46.0000,49.1000,46.0000,0.0000,92.00,106.74,98.20`);
    // 86 / 98 = 87.755 %, 96.1 / 86 = 111.744 %, 96.1 / 98 = 98.061 %.
    expect(rows.at(-2)).toBe(
      `"${name}",Shop total,98.0000,86.0000,96.1000,86.0000,0.0000,87.76,111.74,98.06`,
    );
    expect(rows.at(-1)).toMatch(/^Rounding,"Hours are added up in whole seconds/);

    const payCsv = await as(owner).get(`/api/reports/pay?week=${week}&format=csv`).expect(200);
    expect(payCsv.headers['content-disposition']).toBe(`attachment; filename="baytime-pay-${week}.csv"`);
    const payRows = payCsv.text
      .replace(/^\uFEFF/, '')
      .trimEnd()
      .split('\n');
    expect(payRows[0]).toBe(
      'Week,Week status,Technician,Pay type,Rates from,Flat rate $/h,Hourly rate $/h,Guarantee $/h,' +
        'Overtime exempt,Flagged hours,Hours worked,Rest hours,Rest rate $/h,Rest pay $,' +
        'Other non-productive hours,Other non-productive pay $,Flagged pay $,Guarantee top-up $,Hourly pay $,' +
        'Straight-time pay $,Regular rate $/h,Overtime hours,Double-time hours,Overtime premium $,' +
        'Minimum wage top-up $,Meal premiums $,Week total $,Additional overtime for earlier weeks $,' +
        'Adjustments for closed weeks $,Payable this week $,Unresolved exceptions,Under minimum wage,Near overtime,' +
        'Caution',
    );
    // The week is open and Dex's unclocked line waits for a sign-off: every row says the figures are not final.
    const status = '"open: 1 unresolved exception(s), figures not final"';
    expect(payRows).toContain(
      `"${name}",${status},Ada Vexley,Flat rate,2000-01-01,10.00,8.00,0.00,no,49.1000,50.0000,0.0000,,0.00,` +
        '4.0000,32.00,491.00,0.00,0.00,523.00,10.46,10.0000,0.0000,52.30,0.00,0.00,575.30,0.00,0.00,575.30,0,no,no,',
    );
    expect(payRows.find((row) => row.includes(',Total,'))).toMatch(/,Total,,,,,,,96\.1000,98\.0000,/);
    expect(payRows.at(-2)).toMatch(/^Estimate,"These figures are an estimate/);
    expect(payRows.at(-1)).toMatch(/^Rounding,"Worked out in whole seconds and whole cents/);
  });

  // Rue, flat $22, other time $10. Monday of W: on shift 08:00–12:00, clocked on a 4.0 h line all along, finished at
  // 12:00: 4 × $22 = $88.00; W is closed. Monday of F: on shift 08:00–10:00 on no job: 2 h × $10 = $20.00 (above
  // 2 × $7.25 = $14.50). The line reopened after closing leaves W no flagged time and no idle time: $0 topped up
  // to 4 × $7.25 = $29.00, so F carries $29.00 − $88.00 = −$59.00 for W and pays $20.00 − $59.00 = −$39.00, below
  // the $14.50 for its 2 h: 29 CFR 531.35 (from memory) says a deduction may not cut pay below the minimum wage.
  // Tam, the same rates, is on shift 08:00–12:00 on F's Monday on no job: 4 h × $10 = $40.00, nothing to caution.
  it('says in the pay CSV when an adjustment takes a week’s payable amount below the minimum wage', async () => {
    const [W, F] = [addIsoWeeks(week, -9), addIsoWeeks(week, -8)];
    const rue = await technician('Rue Calder', '5014', 22_00, 10_00);
    const [wMonday] = weekdaysOf(W, shop) as [ShopDay];
    const [fMonday] = weekdaysOf(F, shop) as [ShopDay];
    const job = line('Replace thermostat housing', 4.0, rue, at(wMonday, '07:30'));
    await punch(rue, 'shift-in', at(wMonday, '08:00'));
    await punch(rue, 'job-on', at(wMonday, '08:00'), job);
    await punch(rue, 'job-off', at(wMonday, '12:00'), job);
    await punch(rue, 'shift-out', at(wMonday, '12:00'));
    await finish(job, at(wMonday, '12:00'));
    await punch(rue, 'shift-in', at(fMonday, '08:00'));
    await punch(rue, 'shift-out', at(fMonday, '10:00'));
    const tam = await technician('Tam Orrin', '5015', 22_00, 10_00);
    await punch(tam, 'shift-in', at(fMonday, '08:00'));
    await punch(tam, 'shift-out', at(fMonday, '12:00'));
    await as(owner).post(`/api/pay-weeks/${W}/close`, {}).expect(200);

    const csvRows = async () => {
      const csv = await as(owner).get(`/api/reports/pay?week=${F}&format=csv`).expect(200);
      return parse<Record<string, string>>(csv.text, { bom: true, columns: true, relax_column_count: true });
    };
    expect((await csvRows()).find((row) => row['Technician'] === 'Rue Calder')).toMatchObject({
      'Payable this week $': '20.00',
      Caution: '',
    });

    await as(foreman).patch(`/api/job-lines/${job}`, { status: 'queued' }).expect(200);
    const words =
      'Payable -$39.00 is below the minimum wage for 2 h worked ($14.50 at $7.25 an hour) after an adjustment of ' +
      '-$59.00 from earlier weeks: confirm with payroll before paying; deductions may not cut pay below the ' +
      'minimum wage (29 CFR 531.35). Pay figures are estimates: confirm them with local wage law and your ' +
      'payroll provider.';
    const rows = await csvRows();
    expect(rows.find((row) => row['Technician'] === 'Rue Calder')).toMatchObject({
      'Adjustments for closed weeks $': '-59.00',
      'Payable this week $': '-39.00',
      Caution: words,
    });
    expect(rows.find((row) => row['Technician'] === 'Total')).toMatchObject({ Caution: '' });
    expect(rows.find((row) => row['Technician'] === 'Tam Orrin')).toMatchObject({
      'Payable this week $': '40.00',
      Caution: '',
    });
    // The kiosk's My week reads the technician's own timecard: the same words are there.
    const kiosk = await sut.badge('5014');
    const card = (await as(kiosk.accessToken).get(`/api/timecards?week=${F}`).expect(200)).body as Timecard;
    expect(card.summary.pay?.payableCaution).toBe(words);
  });

  it('counts the running week by default, open shift and job up to now, from punches on the kiosk', async () => {
    const fay = await sut.badge('5006');
    const started = Date.now();
    const { from } = workweekBounds(workweekOf(new Date(started), shop), shop);
    const shiftIn = new Date(Math.max(started - 3 * 3600_000, from.getTime() + 1000));
    const jobOn = new Date(shiftIn.getTime() + (started - shiftIn.getTime()) / 2);
    const job = line('Replace spark plugs', 1.2, ids.f, shiftIn);
    const kiosk = (body: object) => as(fay.accessToken).post('/api/punches', { id: randomUUID(), ...body });
    await kiosk({ kind: 'shift-in', at: shiftIn.toISOString() }).expect(201);
    await kiosk({ kind: 'job-on', jobLineId: job, at: jobOn.toISOString() }).expect(201);

    const before = Date.now();
    const report = await labour('');
    const after = Date.now();
    expect(report.week).toBe(workweekOf(new Date(before), shop));
    const row = rowOf(report, ids.f);
    const hoursSince = (instant: Date, until: number) => (until - instant.getTime()) / 3600_000;
    expect(row.attendanceHours).toBeGreaterThanOrEqual(hoursSince(shiftIn, before) - 1e-4);
    expect(row.attendanceHours).toBeLessThanOrEqual(hoursSince(shiftIn, after) + 1e-4);
    expect(row.clockedHours).toBeGreaterThanOrEqual(hoursSince(jobOn, before) - 1e-4);
    expect(row.clockedHours).toBeLessThanOrEqual(hoursSince(jobOn, after) + 1e-4);
    expect(row.flaggedHours).toBe(0);
    expect(row.lines).toEqual([
      expect.objectContaining({ jobLineId: job, flaggedHours: 0, overUnderHours: null }),
    ]);
  });

  // Common practice, no source: a technician forgets to clock out on a Friday morning and clocks out on
  // Monday afternoon. Until the foreman corrects it, every count sees one shift from Friday to Monday: the
  // week that begins on the Sunday counts it from Sunday 00:00 to Monday 17:00.
  it('counts a shift left open since before the week the same in the report and the timecard, however weeks are read', async () => {
    const later = addIsoWeeks(week, -6);
    const earlier = addIsoWeeks(later, -1);
    const friday = workweekDays(earlier, shop).find(
      (day) => new Date(`${day.day}T12:00:00Z`).getUTCDay() === 5,
    )!;
    const monday = workweekDays(later, shop).find(
      (day) => new Date(`${day.day}T12:00:00Z`).getUTCDay() === 1,
    )!;
    const gil = await technician('Gil Ashdown', '5013', 20_00, 15_00);
    await punch(gil, 'shift-in', at(friday, '07:30'));
    await punch(gil, 'shift-out', at(monday, '17:00'));
    // 41 h, an hour less or more when the clocks change that Sunday.
    const seconds = (at(monday, '17:00').getTime() - workweekBounds(later, shop).from.getTime()) / 1000;

    // Read with the weeks before it (a report's trend, computed afresh and not kept) and read alone, the
    // week's figures are the same.
    const run = [addIsoWeeks(later, -2), earlier, later];
    const [, , inRun] = sut.app.get(WeekFiguresService).figures(run, shop, new Date(), true);
    expect(inRun!.technicians.get(gil)!.totals.attendanceSeconds).toBe(seconds);
    expect(rowOf(await labour(`week=${later}`), gil).attendanceHours).toBe(seconds / 3600);
    const card = (await as(owner).get(`/api/timecards?technicianId=${gil}&week=${later}`).expect(200))
      .body as Timecard;
    expect(card.totals.attendanceSeconds).toBe(seconds);
    expect(card.anomalies).toEqual([]);
  });

  it('counts the running week once for one instant, and again for a later one or after a punch', async () => {
    const reports = sut.app.get(ReportsService);
    const counted = vi.spyOn(
      sut.app.get(WeekFiguresService) as never as { compute: () => unknown },
      'compute',
    );
    const lou = await technician('Lou Brennick', '5012', 20_00, 15_00);
    const now = new Date();
    const running = workweekOf(now, shop);
    const shiftIn = new Date(
      Math.max(now.getTime() - 2 * 3600_000, workweekBounds(running, shop).from.getTime() + 1000),
    );
    await punch(lou, 'shift-in', shiftIn);
    const hoursTo = (instant: Date) => (instant.getTime() - shiftIn.getTime()) / 3600_000;
    counted.mockClear();

    // A timecard reads its labour row and its pay row from the same running week.
    const first = reports.technicianWeek(running, lou, 'owner', now);
    expect(counted).toHaveBeenCalledTimes(1);
    expect(first.pay!.hoursWorked).toBeCloseTo(hoursTo(now), 2);

    const later = new Date(now.getTime() + 60_000);
    expect(reports.technicianWeek(running, lou, 'owner', later).pay!.hoursWorked).toBeCloseTo(
      hoursTo(later),
      2,
    );
    expect(counted).toHaveBeenCalledTimes(2);

    const shiftOut = new Date((shiftIn.getTime() + now.getTime()) / 2);
    await punch(lou, 'shift-out', shiftOut);
    expect(reports.technicianWeek(running, lou, 'owner', now).pay!.hoursWorked).toBeCloseTo(
      hoursTo(shiftOut),
      2,
    );
    expect(counted).toHaveBeenCalledTimes(3);
    counted.mockRestore();
  });

  it("reads a technician's hours the same from that technician's figures as from the whole shop's", async () => {
    // A week of its own: Juno and Omar share a line; Omar finishes a line begun the week before; a line
    // assigned to Juno that nobody clocked on counts once signed off.
    const label = addIsoWeeks(week, -10);
    const [monday] = weekdaysOf(addIsoWeeks(label, -1), shop) as [ShopDay];
    const [, tuesday] = weekdaysOf(label, shop) as [ShopDay, ShopDay];
    const juno = await technician('Juno Pellam', '5081', 20_00, 15_00);
    const omar = await technician('Omar Reith', '5082', 20_00, 15_00);
    const shared = line('Replace clutch kit', 3.0, juno, at(tuesday, '06:30'));
    const own = line('Replace brake pads', 1.5, omar, at(tuesday, '06:30'));
    const begun = line('Rebuild the cylinder head', 6.0, omar, at(monday, '07:30'));
    const unclocked = line('Check tyre pressures', 0.3, juno, at(tuesday, '06:30'));
    await punch(omar, 'shift-in', at(monday, '08:00'));
    await punch(omar, 'job-on', at(monday, '08:00'), begun);
    await punch(omar, 'job-off', at(monday, '10:00'), begun);
    await punch(omar, 'shift-out', at(monday, '12:00'));
    await punch(juno, 'shift-in', at(tuesday, '07:00'));
    await punch(omar, 'shift-in', at(tuesday, '07:00'));
    await punch(juno, 'job-on', at(tuesday, '07:00'), shared);
    await punch(omar, 'job-on', at(tuesday, '07:00'), own);
    await punch(omar, 'job-off', at(tuesday, '08:00'), own);
    await punch(omar, 'job-on', at(tuesday, '08:00'), shared);
    await punch(omar, 'job-off', at(tuesday, '09:00'), shared);
    await punch(juno, 'job-off', at(tuesday, '10:00'), shared);
    await punch(omar, 'job-on', at(tuesday, '10:00'), begun);
    await punch(omar, 'job-off', at(tuesday, '11:00'), begun);
    await punch(juno, 'shift-out', at(tuesday, '12:00'));
    await punch(omar, 'shift-out', at(tuesday, '12:00'));
    for (const [job, time] of [
      [shared, '10:00'],
      [own, '10:00'],
      [begun, '11:00'],
      [unclocked, '11:00'],
    ] as const)
      await finish(job, at(tuesday, time));
    await as(foreman)
      .post(`/api/job-lines/${unclocked}/sign-off`, { reason: 'Checked at the front desk' })
      .expect(200);

    const now = new Date();
    const shopService = sut.app.get(ShopService);
    const whole = new WeekFiguresService(db, shopService).figures([label], shop, now)[0]!;
    expect([...whole.flagged.get(juno)!.keys()].sort()).toEqual([shared, unclocked].sort());
    for (const technicianId of [juno, omar]) {
      const alone = new WeekFiguresService(db, shopService).figuresOf(label, technicianId, shop, now);
      expect(labourSecondsOf(alone, technicianId), `technician ${technicianId}`).toEqual(
        labourSecondsOf(whole, technicianId),
      );
    }
  });

  it("gives the demo shop's week of punches real figures for every technician", async () => {
    const dana = db.select().from(users).where(eq(users.badge, '1041')).get()!;
    const first = db
      .select({ at: min(punches.at) })
      .from(punches)
      .where(eq(punches.technicianId, dana.id))
      .get()!.at!;
    const demoWeek = workweekOf(first, shop);
    const report = await labour(`week=${demoWeek}`);
    const demo = report.technicians.filter((row: LabourReportTechnician) =>
      [
        'Dana Okafor',
        'Luis Brennan',
        'Priya Castell',
        'Marcus Lindqvist',
        'Jo Whitfield',
        'Sam Ortega',
      ].includes(row.name),
    );
    expect(demo).toHaveLength(6);
    for (const row of demo) {
      expect(row.attendanceHours, row.name).toBeGreaterThan(0);
      expect(row.clockedHours, row.name).toBeGreaterThan(0);
      expect(row.flaggedHours, row.name).toBeGreaterThan(0);
      expect(row.lines.length, row.name).toBeGreaterThan(0);
      // The demo paces run from 0.8 to 1.3 flagged hours per clocked hour, ± 15 %.
      expect(row.efficiency!, row.name).toBeGreaterThan(0.6);
      expect(row.efficiency!, row.name).toBeLessThan(1.6);
    }
    expect(report.shop.productivity!).toBeGreaterThan(0.5);
    expect(report.shop.productivity!).toBeLessThanOrEqual(1);
    expect(report.bayUtilisation.some((bay) => (bay.week ?? 0) > 0)).toBe(true);
    const wages = await pay(`week=${demoWeek}`);
    expect(wages.totals.totalCents).toBeGreaterThan(0);
  });

  it('refuses a week that does not exist or an unknown format with 400 and the field', async () => {
    const bad = await as(owner).get('/api/reports/labour?week=2026-W54').expect(400);
    expect(bad.body.issues[0].path).toEqual(['week']);
    await as(owner).get('/api/reports/pay?format=xlsx').expect(400);
  });

  // California Labor Code 510(a), a general overtime guide's worked example: hourly $25; Mon 10, Tue 8,
  // Wed 13, Thu 8, Fri 8 = 47 h → 40 regular ($1,000) + 6 h at 1.5× ($225) + 1 h at 2× ($50) = $1,275.
  it('pays the California daily-overtime vector when the shop chooses those rules', async () => {
    const earlier = addIsoWeeks(week, -1);
    // Federal first (29 USC 207(a)(1)): only the weekly 40 counts: 47 × $25 + 7 × $12.50 = $1,262.50.
    const federal = (await pay(`week=${earlier}`)).technicians.find((row) => row.technicianId === ids.e)!;
    expect(federal).toMatchObject({ hoursWorked: 47, overtimeHours: 7, totalCents: 1262_50 });
    // California needs the state minimum wage; the rules are dated from that week's first day.
    const payRulesFrom = workweekDays(earlier, shop)[0]!.day;
    await as(owner).patch('/api/shop', { overtimeRules: 'california', payRulesFrom }).expect(400);
    await as(owner)
      .patch('/api/shop', { overtimeRules: 'california', minimumWageCents: 16_50, payRulesFrom })
      .expect(200);
    try {
      const rules = (await as(owner).get('/api/shop/pay-rules').expect(200)).body as DatedPayRules[];
      expect(rules.map((rule) => [rule.effectiveFrom, rule.overtimeRules])).toEqual([
        ['2000-01-01', 'federal'],
        [payRulesFrom, 'california'],
      ]);
      const report = await pay(`week=${earlier}`);
      expect(report.rules).toBe('california');
      expect(report.technicians.find((row) => row.technicianId === ids.e)).toMatchObject({
        hoursWorked: 47,
        regularRateCents: 25_00,
        overtimeHours: 7,
        doubleTimeHours: 1,
        totalCents: 1275_00,
      });
    } finally {
      await as(owner)
        .patch('/api/shop', { overtimeRules: 'federal', minimumWageCents: 7_25, payRulesFrom })
        .expect(200);
    }
  });

  it('shows the same figures on the pay summary, in the CSV and on the kiosk for the same week', async () => {
    const report = await pay(`week=${week}`);
    const row = report.technicians.find((tech) => tech.technicianId === ids.a)!;
    const kiosk = await sut.badge('5001');
    const card = (await as(kiosk.accessToken).get(`/api/timecards?week=${week}`).expect(200))
      .body as Timecard;
    expect(card.summary.pay).toEqual(row);
    expect(card.summary.caution).toBe(report.caution);
    const labourRow = rowOf(await labour(`week=${week}`), ids.a);
    const { lines: _lines, lineTotals: _totals, technicianId: _id, name: _name, ...figures } = labourRow;
    expect(card.summary.labour).toEqual(figures);
    expect(card.weekName).toBe(report.weekName);

    const csv = await as(owner).get(`/api/reports/pay?week=${week}&format=csv`).expect(200);
    const [header, ...rows] = csv.text
      .replace(/^\uFEFF/, '')
      .trimEnd()
      .split('\n');
    const cells = (line: string) =>
      line.match(/("[^"]*"|[^,]*)(,|$)/g)!.map((c) => c.replace(/,$/, '').replace(/^"|"$/g, ''));
    const columns = cells(header!);
    const ada = cells(rows.find((line) => line.includes('Ada Vexley'))!);
    const value = (column: string) => ada[columns.indexOf(column)];
    expect(value('Flagged hours')).toBe(row.flaggedHours.toFixed(4));
    expect(value('Hours worked')).toBe(row.hoursWorked.toFixed(4));
    expect(value('Week total $')).toBe((row.totalCents / 100).toFixed(2));
    expect(value('Payable this week $')).toBe((row.payableCents / 100).toFixed(2));

    // A shop that hides pay on the kiosk still shows the hours there; the office keeps the pay.
    await as(owner).patch('/api/shop', { kioskShowsPay: false }).expect(200);
    try {
      const hidden = (await as(kiosk.accessToken).get(`/api/timecards?week=${week}`).expect(200))
        .body as Timecard;
      expect(hidden.summary).toMatchObject({ pay: null, labour: figures });
      const office = (await as(owner).get(`/api/timecards?technicianId=${ids.a}&week=${week}`).expect(200))
        .body as Timecard;
      expect(office.summary.pay).toEqual(row);
    } finally {
      await as(owner).patch('/api/shop', { kioskShowsPay: true }).expect(200);
    }
  });

  // Done on a line nobody clocked on used to flag its book hours while the same hours were paid as idle.
  // Hal: flat $20, other time $15; on shift 08:00–12:00 and never clocked on; his 2.0 h line marked done at
  // 11:00. Until signed off: flagged 0, other time 4 h × $15 = $60, total $60 (not also 2 × $20).
  it('keeps Done without clocked time out of flagged hours until a foreman signs it off', async () => {
    const later = addIsoWeeks(week, 1);
    const wednesday = workweekDays(later, shop)[3]!;
    const hal = await technician('Hal Brenner', '5008', 20_00, 15_00);
    const job = line('Replace cabin air filter', 2.0, hal, at(wednesday, '07:30'));
    await punch(hal, 'shift-in', at(wednesday, '08:00'));
    await punch(hal, 'shift-out', at(wednesday, '12:00'));
    const done = await finish(job, at(wednesday, '11:00'));
    expect(done.body.signOff).toBe('awaiting');
    const halRow = async () =>
      (await pay(`week=${later}`)).technicians.find((tech) => tech.technicianId === hal)!;
    expect(await halRow()).toMatchObject({
      flaggedHours: 0,
      flaggedPayCents: 0,
      otherNonProductiveHours: 4,
      otherNonProductivePayCents: 60_00,
      totalCents: 60_00,
      unresolvedExceptions: 1,
    });
    expect((await halRow()).exceptions[0]).toMatchObject({
      kind: 'done-unclocked',
      jobLineId: job,
      resolution: null,
    });

    const technicianToken = (await sut.badge('5008')).accessToken;
    await as(technicianToken).post(`/api/job-lines/${job}/sign-off`, { reason: 'I did it' }).expect(403);
    await as(foreman).post(`/api/job-lines/${job}/sign-off`, {}).expect(400);
    const signed = await as(foreman)
      .post(`/api/job-lines/${job}/sign-off`, { reason: 'Filter swap done at the car park, seen by me' })
      .expect(200);
    expect(signed.body.signOff).toBe('signed');
    await as(foreman).post(`/api/job-lines/${job}/sign-off`, { reason: 'again' }).expect(409);
    // Signed off: 2.0 h × $20 = $40 flagged; the exception is resolved, with who and why.
    const after = await halRow();
    expect(after).toMatchObject({ flaggedHours: 2, flaggedPayCents: 40_00, unresolvedExceptions: 0 });
    expect(after.exceptions[0]!.resolution).toMatchObject({
      by: 'Theo Varga',
      note: 'Signed off: Filter swap done at the car park, seen by me',
    });
    const audit = db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.action, 'sign-off'), eq(auditLog.entityId, String(job))))
      .all();
    expect(audit.map((entry) => entry.detail)).toEqual([
      { reason: 'Filter swap done at the car park, seen by me' },
    ]);
  });
  // A past week's figures are kept between reports: whatever reaches back into the week shows at once.
  it('counts a past week again after a late punch, a correction, or a line finished or reopened in it', async () => {
    const past = addIsoWeeks(week, -4);
    const [monday, tuesday] = weekdaysOf(past, shop) as [ShopDay, ShopDay];
    const ivy = await technician('Ivy Quell', '5009', 20_00, 15_00);
    const labourRow = async () => rowOf(await labour(`week=${past}`), ivy);
    const payRow = async () =>
      (await pay(`week=${past}`)).technicians.find((row) => row.technicianId === ivy)!;
    await punch(ivy, 'shift-in', at(monday, '08:00'));
    const shiftOut = (await punch(ivy, 'shift-out', at(monday, '12:00'))).body as PunchDto;
    expect(await labourRow()).toMatchObject({ attendanceHours: 4 });
    expect(await payRow()).toMatchObject({ hoursWorked: 4 });

    await punch(ivy, 'shift-in', at(tuesday, '13:00'));
    await punch(ivy, 'shift-out', at(tuesday, '16:00'));
    expect(await labourRow()).toMatchObject({ attendanceHours: 7 });
    expect(await payRow()).toMatchObject({ hoursWorked: 7 });

    await as(owner)
      .post('/api/timecards/corrections', {
        punchId: shiftOut.id,
        technicianId: ivy,
        kind: 'shift-out',
        at: at(monday, '11:00').toISOString(),
        reason: 'Left at 11 for a dentist appointment',
      })
      .expect(201);
    expect(await labourRow()).toMatchObject({ attendanceHours: 6 });
    expect(await payRow()).toMatchObject({ hoursWorked: 6 });

    const job = line('Replace wiper blades', 1.5, ivy, at(tuesday, '12:00'));
    await punch(ivy, 'job-on', at(tuesday, '13:00'), job);
    await punch(ivy, 'job-off', at(tuesday, '14:00'), job);
    expect(await labourRow()).toMatchObject({ clockedHours: 1, flaggedHours: 0 });
    await finish(job, at(tuesday, '14:00'));
    expect(await labourRow()).toMatchObject({ clockedHours: 1, flaggedHours: 1.5 });
    expect(await payRow()).toMatchObject({ flaggedHours: 1.5 });
    await as(foreman).patch(`/api/job-lines/${job}`, { status: 'working' }).expect(200);
    expect(await labourRow()).toMatchObject({ flaggedHours: 0 });
    expect(await payRow()).toMatchObject({ flaggedHours: 0 });
  });

  // 29 CFR 785.19(a): a bona fide meal period is ordinarily 30 minutes or more; the shop sets its minimum.
  it('keeps past weeks as counted when a counting rule changes after them', async () => {
    const earlier = addIsoWeeks(week, -1);
    const eli = async () =>
      (await pay(`week=${earlier}`)).technicians.find((row) => row.technicianId === ids.e)!;
    expect((await labour(`week=${week}`)).trend[10]).toMatchObject({ attendanceHours: 47 });
    expect(await eli()).toMatchObject({ hoursWorked: 47 });
    // Read under a 45-minute minimum, Eli's six 30-minute meals would be paid rest (47 + 6 × 0.5 = 50 h); they
    // were taken under the 30-minute one, and stay meals.
    await as(owner).patch('/api/shop', { minimumMealMinutes: 45 }).expect(200);
    try {
      expect((await labour(`week=${week}`)).trend[10]).toMatchObject({ attendanceHours: 47 });
      expect(await eli()).toMatchObject({ hoursWorked: 47 });
    } finally {
      await as(owner).patch('/api/shop', { minimumMealMinutes: 30 }).expect(200);
    }
  });

  it('keeps no figures read inside a transaction that was rolled back', async () => {
    const past = addIsoWeeks(week, -5);
    const [monday] = weekdaysOf(past, shop) as [ShopDay];
    const jo = await technician('Jo Pell', '5010', 20_00, 15_00);
    await punch(jo, 'shift-in', at(monday, '08:00'));
    await punch(jo, 'shift-out', at(monday, '12:00'));
    expect(rowOf(await labour(`week=${past}`), jo)).toMatchObject({ attendanceHours: 4 });
    const late = (kind: 'shift-in' | 'shift-out', time: string) =>
      db
        .insert(punches)
        .values({
          id: randomUUID(),
          technicianId: jo,
          kind,
          at: at(monday, time),
          recordedAt: new Date(),
          recordedBy: jo,
        })
        .run();
    expect(() =>
      db.transaction(() => {
        late('shift-in', '13:00');
        late('shift-out', '15:00');
        expect(rowOf(sut.app.get(ReportsService).labour(past), jo)).toMatchObject({ attendanceHours: 6 });
        throw new Error('Rolled back');
      }),
    ).toThrow('Rolled back');
    expect(rowOf(await labour(`week=${past}`), jo)).toMatchObject({ attendanceHours: 4 });
  });

  it("counts a first report's trend weeks one turn of the event loop at a time", async () => {
    const label = addIsoWeeks(week, -20);
    const counted = addIsoWeeks(label, -3);
    const [monday] = weekdaysOf(counted, shop) as [ShopDay];
    const kit = await technician('Kit Amberly', '5011', 20_00, 15_00);
    await punch(kit, 'shift-in', at(monday, '08:00'));
    await punch(kit, 'shift-out', at(monday, '12:00'));

    let answered = false;
    let turnsWhileCounting = 0;
    const countTurns = () =>
      setImmediate(() => {
        if (answered) return;
        turnsWhileCounting += 1;
        countTurns();
      });
    countTurns();
    const report = (await sut.app.get(ReportsService).labourAnswer({ week: label })) as LabourReport;
    answered = true;

    // None of the eleven past weeks was asked before: each is counted in a turn of its own.
    expect(turnsWhileCounting).toBeGreaterThanOrEqual(LABOUR_TREND_WEEKS - 1);
    expect(report.trend.find((row) => row.week === counted)).toMatchObject({ attendanceHours: 4 });
    expect(report).toEqual(sut.app.get(ReportsService).labour(label));
  });
});
