import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import {
  addIsoWeeks,
  shopLocalInstant,
  workweekDays,
  workweekName,
  workweekOf,
  type PayReport,
  type PayReportTechnician,
  type ShopDay,
  type ShopSettings,
  type UserDto,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog, users } from '../db/schema/index.js';
import { ReportsService } from '../reports/reports.service.js';
import { shopHistory, type ShopHistory } from '../test-support/shop-history.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { PayWeeksService } from './pay-weeks.service.js';

/**
 * Weeks four to seven back, before the demo shop's punches: Kai works week W, which is closed; F is the first
 * open week after it. Lia's long line runs from week E into F2. Times are shop-local (America/Chicago).
 */
describe(PayWeeksService.name, () => {
  let sut: TestApp;
  let owner: string;
  let foreman: string;
  let shop: ShopSettings;
  let history: ShopHistory;
  const weeks = { current: '', E: '', F2: '', W: '', F: '' };
  let kai: number;
  let kaiLine: number;
  let lia: number;
  const at = (day: ShopDay, time: string) => shopLocalInstant(day.day, time, shop.timeZone);
  const monday = (week: string) => workweekDays(week, shop)[1]!;
  const pay = async (week: string) =>
    (await history.as(owner).get(`/api/reports/pay?week=${week}`).expect(200)).body as PayReport;
  const rowOf = (report: PayReport, technicianId: number): PayReportTechnician =>
    report.technicians.find((row) => row.technicianId === technicianId)!;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
    history = shopHistory(sut, { owner, foreman });
    shop = (await history.as(owner).get('/api/shop').expect(200)).body as ShopSettings;
    weeks.current = workweekOf(new Date(), shop);
    [weeks.E, weeks.F2, weeks.W, weeks.F] = [-7, -6, -5, -4].map((n) => addIsoWeeks(weeks.current, n)) as [
      string,
      string,
      string,
      string,
    ];

    // Kai, flat $20, other time $10. Monday of W: on shift 08:00–17:00 with a meal 12:00–12:30 (8.5 h),
    // clocked on a 6.0 h line 08:00–12:00 and 12:30–16:30 (8 h), finished at 16:30; idle 16:30–17:00.
    kai = await history.technician('Kai Morrell', '6001', 20_00, 10_00);
    const day = monday(weeks.W);
    kaiLine = history.line('Replace timing belt', 6.0, kai, at(day, '07:30'));
    await history.punch(kai, 'shift-in', at(day, '08:00'));
    await history.punch(kai, 'job-on', at(day, '08:00'), kaiLine);
    await history.punch(kai, 'job-off', at(day, '12:00'), kaiLine);
    await history.punch(kai, 'break-start', at(day, '12:00'));
    await history.punch(kai, 'break-end', at(day, '12:30'));
    await history.punch(kai, 'job-on', at(day, '12:30'), kaiLine);
    await history.punch(kai, 'job-off', at(day, '16:30'), kaiLine);
    await history.punch(kai, 'shift-out', at(day, '17:00'));
    await history.finish(kaiLine, at(day, '16:30'));

    // Lia, flat $20, other time $10: in E five days 07:00–17:00 clocked all day on a 60 h line (50 h, so 10 h
    // of overtime); in F2 Monday 08:00–16:00 on it again (8 h), finished at 16:00.
    lia = await history.technician('Lia Fenwick', '6002', 20_00, 10_00);
    const days = workweekDays(weeks.E, shop).slice(1, 6);
    const long = history.line('Rebuild automatic transmission', 60, lia, at(days[0]!, '06:30'));
    for (const workday of days) {
      await history.punch(lia, 'shift-in', at(workday, '07:00'));
      await history.punch(lia, 'job-on', at(workday, '07:00'), long);
      await history.punch(lia, 'job-off', at(workday, '17:00'), long);
      await history.punch(lia, 'shift-out', at(workday, '17:00'));
    }
    const finishing = monday(weeks.F2);
    await history.punch(lia, 'shift-in', at(finishing, '08:00'));
    await history.punch(lia, 'job-on', at(finishing, '08:00'), long);
    await history.punch(lia, 'job-off', at(finishing, '16:00'), long);
    await history.punch(lia, 'shift-out', at(finishing, '16:00'));
    await history.finish(long, at(finishing, '16:00'));
  }, 120_000);
  afterAll(() => sut.close());

  // Kai's week W by hand: 6 h × $20 = $120 + 0.5 h × $10 = $5 → $125.00 (8.5 h × $7.25 = $61.63 is below).
  it('closes an ended week for the owner only, keeping its pay summary', async () => {
    await history.as(owner).post(`/api/pay-weeks/${weeks.current}/close`, {}).expect(409);
    await history.as(foreman).post(`/api/pay-weeks/${weeks.W}/close`, {}).expect(403);
    const { body } = await history.as(owner).post(`/api/pay-weeks/${weeks.W}/close`, {}).expect(200);
    expect(body).toMatchObject({ week: weeks.W, closed: true, closedBy: 'Rosa Pellman' });
    await history.as(owner).post(`/api/pay-weeks/${weeks.W}/close`, {}).expect(409);
    const report = await pay(weeks.W);
    expect(report).toMatchObject({ closed: true, closedBy: 'Rosa Pellman' });
    expect(rowOf(report, kai)).toMatchObject({ flaggedHours: 6, totalCents: 125_00, payableCents: 125_00 });
  });

  it('refuses a correction, a completion or a rate dated in the closed week with 409 and a plain reason', async () => {
    const tuesday = workweekDays(weeks.W, shop)[2]!;
    const refused = await history
      .as(owner)
      .post('/api/timecards/corrections', {
        technicianId: kai,
        kind: 'shift-in',
        at: at(tuesday, '08:00').toISOString(),
        reason: 'Forgot to punch in',
      })
      .expect(409);
    const name = workweekName(weeks.W, shop, true).replace('Week of ', '');
    expect(refused.body.message).toBe(
      `That correction falls in the pay week of ${name}, which is closed for pay: ask the owner to reopen it`,
    );
    const other = history.line('Replace wiper blades', 0.3, kai, at(monday(weeks.F), '07:00'));
    const completion = await history
      .as(foreman)
      .patch(`/api/job-lines/${other}`, { completedAt: at(tuesday, '10:00').toISOString() })
      .expect(409);
    expect(completion.body.message).toMatch(/^That completion time falls in the pay week .* closed for pay/);
    // A rate applies to the weeks that begin on or after its date: dated W's first day, it would change W.
    const rate = await history
      .as(owner)
      .patch(`/api/users/${kai}`, {
        flatRateCents: 22_00,
        effectiveFrom: workweekDays(weeks.W, shop)[0]!.day,
      })
      .expect(409);
    expect(rate.body.message).toMatch(/^That rate would change the Week of .* pay week, which is closed/);
  });

  // A person just added has no hours in any week, so their first rate (from 2000-01-01) changes no closed
  // week. By hand, Nia's Monday of F: 08:00–12:00 on shift (4 h), clocked on a 3.5 h line 08:00–11:00 and
  // finished then; idle 11:00–12:00. 3.5 h × $24 = $84.00 + 1 h × $12 = $12.00 → $96.00 (4 h × $7.25 = $29 is
  // below).
  it('adds a technician while a week is closed, paying them at their first rate', async () => {
    const added = await history
      .as(owner)
      .post('/api/users', {
        name: 'Nia New',
        role: 'technician',
        badge: '6004',
        pin: '4321',
        flatRateCents: 24_00,
        hourlyRateCents: 12_00,
      })
      .expect(201);
    const nia = (added.body as UserDto).id;
    expect((added.body as UserDto).payRates.map((rate) => rate.effectiveFrom)).toEqual(['2000-01-01']);
    expect(rowOf(await pay(weeks.current), nia)).toMatchObject({
      flatRateCents: 24_00,
      hourlyRateCents: 12_00,
      rateFrom: '2000-01-01',
    });
    const day = monday(weeks.F);
    const line = history.line('Replace front pads', 3.5, nia, at(day, '07:30'));
    await history.punch(nia, 'shift-in', at(day, '08:00'));
    await history.punch(nia, 'job-on', at(day, '08:00'), line);
    await history.punch(nia, 'job-off', at(day, '11:00'), line);
    await history.punch(nia, 'shift-out', at(day, '12:00'));
    await history.finish(line, at(day, '11:00'));
    expect(rowOf(await pay(weeks.F), nia)).toMatchObject({
      flaggedPayCents: 84_00,
      otherNonProductivePayCents: 12_00,
      totalCents: 96_00,
      payableCents: 96_00,
    });
    // A change of an existing technician's rate dated in the closed week is still refused.
    const change = await history
      .as(owner)
      .patch(`/api/users/${nia}`, {
        flatRateCents: 26_00,
        effectiveFrom: workweekDays(weeks.W, shop)[0]!.day,
      })
      .expect(409);
    expect(change.body.message).toMatch(/^That rate would change the Week of .* pay week, which is closed/);
  });

  // Kai's line reopened after W closed: W now counts no flagged time, so by hand W would pay 0.5 h × $10 = $5
  // topped up to 8.5 h × $7.25 = $61.625 → $61.63 (half a cent rounds up): $61.63 − $125.00 = −$63.37,
  // shown in F, the first open week, for W. W itself does not change.
  it('shows a line changed after closing as an adjustment in the first open week, labelled with its week', async () => {
    await history.as(foreman).patch(`/api/job-lines/${kaiLine}`, { status: 'queued' }).expect(200);
    expect(rowOf(await pay(weeks.W), kai)).toMatchObject({ totalCents: 125_00 });
    const adjustment = {
      technicianId: kai,
      forWeek: weeks.W,
      forWeekName: workweekName(weeks.W, shop),
      flaggedHours: -6,
      cents: -63_37,
    };
    const f = await pay(weeks.F);
    expect(f.adjustments).toEqual([adjustment]);
    expect(rowOf(f, kai)).toMatchObject({
      adjustments: [adjustment],
      adjustmentCents: -63_37,
      payableCents: -63_37,
    });
    // The pay math stays; the row says the payable amount is negative with no hours worked in F, for payroll
    // to confirm (29 CFR 531.35, from memory).
    expect(rowOf(f, kai).payableCaution).toBe(
      'Payable -$63.37 is negative after an adjustment of -$63.37 from earlier weeks, with no hours worked this ' +
        'week: confirm with payroll before paying; deductions may not cut pay below the minimum wage (29 CFR ' +
        '531.35). Pay figures are estimates: confirm them with local wage law and your payroll provider.',
    );

    // Finished again in F: flagged there (6 h × $20 = $120); its time was all clocked in W, so 29 CFR 778.119
    // leaves it out of F's regular rate, and W had no overtime to add to. F pays $120 − $63.37 = $56.63.
    await history.finish(kaiLine, at(monday(weeks.F), '10:00'));
    expect(rowOf(await pay(weeks.F), kai)).toMatchObject({
      flaggedPayCents: 120_00,
      totalCents: 120_00,
      additionalOvertime: [],
      adjustmentCents: -63_37,
      payableCents: 56_63,
      payableCaution: null,
    });
  });

  it('reopens a closed week for the owner with a reason, audited', async () => {
    await history.as(owner).post(`/api/pay-weeks/${weeks.W}/reopen`, {}).expect(400);
    await history
      .as(foreman)
      .post(`/api/pay-weeks/${weeks.W}/reopen`, { reason: 'Timing belt redone' })
      .expect(403);
    const { body } = await history
      .as(owner)
      .post(`/api/pay-weeks/${weeks.W}/reopen`, { reason: 'Timing belt line moved to the next week' })
      .expect(200);
    expect(body).toMatchObject({ closed: false, reopenReason: 'Timing belt line moved to the next week' });
    const db = sut.app.get<Db>(DB);
    const audit = db
      .select({ action: auditLog.action, detail: auditLog.detail, actor: users.name })
      .from(auditLog)
      .innerJoin(users, eq(users.id, auditLog.actorId))
      .where(and(eq(auditLog.entity, 'pay-week'), eq(auditLog.entityId, weeks.W)))
      .all();
    expect(audit).toEqual([
      { action: 'close', detail: { totalCents: expect.any(Number) }, actor: 'Rosa Pellman' },
      {
        action: 'reopen',
        detail: { reason: 'Timing belt line moved to the next week' },
        actor: 'Rosa Pellman',
      },
    ]);
    // Open again: W is worked out live ($61.63, the line now being F's) and F carries no adjustment.
    expect(rowOf(await pay(weeks.W), kai)).toMatchObject({ totalCents: 61_63 });
    expect((await pay(weeks.F)).adjustments).toEqual([]);
    await history.as(owner).post(`/api/pay-weeks/${weeks.W}/reopen`, { reason: 'again' }).expect(409);
  });

  it('pays each week with the rates in force when it began: a raise dated next month changes nothing now', async () => {
    const dana = sut.app.get<Db>(DB).select().from(users).where(eq(users.badge, '1041')).get()!.id;
    const reports = sut.app.get(ReportsService);
    const now = new Date();
    const before = rowOf(reports.pay(weeks.current, now), dana);
    expect(before.totalCents).toBeGreaterThan(0);
    const [year, month] = now.toISOString().slice(0, 7).split('-').map(Number) as [number, number];
    const nextMonth = `${month === 12 ? year + 1 : year}-${String((month % 12) + 1).padStart(2, '0')}-01`;
    const raised = await history
      .as(owner)
      .patch(`/api/users/${dana}`, { flatRateCents: 99_00, hourlyRateCents: 99_00, effectiveFrom: nextMonth })
      .expect(200);
    expect((raised.body as UserDto).payRates.map((rate) => rate.effectiveFrom)).toEqual([
      nextMonth,
      '2000-01-01',
    ]);
    expect(raised.body).toMatchObject({ flatRateCents: 32_00, hourlyRateCents: 18_00 });
    expect(rowOf(reports.pay(weeks.current, now), dana)).toEqual(before);

    // Kai's $25 dated from F's first day: F's 6 flagged hours pay 6 × $25 = $150; W keeps $20.
    await history
      .as(owner)
      .patch(`/api/users/${kai}`, {
        flatRateCents: 25_00,
        effectiveFrom: workweekDays(weeks.F, shop)[0]!.day,
      })
      .expect(200);
    expect(rowOf(await pay(weeks.F), kai)).toMatchObject({ flatRateCents: 25_00, flaggedPayCents: 150_00 });
    expect(rowOf(await pay(weeks.W), kai)).toMatchObject({ flatRateCents: 20_00, rateFrom: '2000-01-01' });
    await history.as(owner).patch(`/api/users/${kai}`, { effectiveFrom: nextMonth }).expect(400);
  });

  // 29 CFR 778.119 (from memory), applied to flat-rate pay by analogy: Lia's 60 h line ($1,200 at $20) was
  // clocked 50 h in E and 8 h in F2. E's share: $1,200 × 50/58 = $1,034.48, so E's regular rate rises by
  // $1,034.48 ÷ 50 h = $20.69 and its 10 overtime hours are owed half of that more: $103.45 (by hand). F2
  // keeps only its own share in its regular rate: ($1,200 − $1,034.48) ÷ 8 h = $20.69.
  it('owes additional overtime for an earlier week on a line finished later, shown in the finishing week', async () => {
    const row = rowOf(await pay(weeks.F2), lia);
    expect(row).toMatchObject({
      flaggedPayCents: 1200_00,
      regularRateCents: 20_69,
      totalCents: 1200_00,
      additionalOvertime: [{ forWeek: weeks.E, forWeekName: workweekName(weeks.E, shop), cents: 103_45 }],
      additionalOvertimeCents: 103_45,
      payableCents: 1303_45,
    });
    // A shop may turn the apportioning off: the whole $1,200 then counts in F2's rate, $1,200 ÷ 8 h = $150.
    await history.as(owner).patch('/api/shop', { apportionSpanningLines: false }).expect(200);
    try {
      expect(rowOf(await pay(weeks.F2), lia)).toMatchObject({
        regularRateCents: 150_00,
        additionalOvertime: [],
      });
    } finally {
      await history.as(owner).patch('/api/shop', { apportionSpanningLines: true }).expect(200);
    }
  });

  // Ola, flat $20, other time $10, works only in A: Monday 08:00–12:00 on a 4.0 h line, finished at 12:00, so
  // A pays 4 h × $20 = $80 (4 h × $7.25 = $29 is below). The line reopened after A and B closed: A would now
  // flag nothing, its 4 h being on the open line, so it pays the minimum wage, $29, and the first open week,
  // C, carries $29 − $80 = −$51 for A, by hand.
  it('carries an adjustment once when a week before the one that carried it is reopened and closed again', async () => {
    const [a, b, c, d] = [-11, -10, -9, -8].map((n) => addIsoWeeks(weeks.current, n)) as [
      string,
      string,
      string,
      string,
    ];
    const ola = await history.technician('Ola Brandt', '6005', 20_00, 10_00);
    const day = monday(a);
    const line = await history.workedLine(
      ola,
      'Replace rear shocks',
      4.0,
      at(day, '08:00'),
      at(day, '12:00'),
    );
    const close = (week: string) => history.as(owner).post(`/api/pay-weeks/${week}/close`, {}).expect(200);
    await close(a);
    await close(b);
    await history.as(foreman).patch(`/api/job-lines/${line}`, { status: 'queued' }).expect(200);
    const forA = {
      technicianId: ola,
      forWeek: a,
      forWeekName: workweekName(a, shop),
      flaggedHours: -4,
      cents: -51_00,
    };
    expect((await pay(c)).adjustments).toEqual([forA]);
    await close(c);

    // B reopened: C, closed after A, has carried A's change, so B carries nothing for A, open or closed again.
    await history.as(owner).post(`/api/pay-weeks/${b}/reopen`, { reason: 'A missed punch' }).expect(200);
    expect((await pay(b)).adjustments).toEqual([]);
    await close(b);
    expect((await pay(d)).adjustments).toEqual([]);
    expect(rowOf(await pay(c), ola)).toMatchObject({ adjustments: [forA], payableCents: -51_00 });
  });

  // A night shift from Saturday 23:00 to Sunday 07:30 crosses the end of week G into H. Its shift-out is on
  // record, so G has no open shift to review and closes; a shift-in Saturday with no shift-out at all is
  // still one.
  it('closes a week whose last shift ended after it, and still stops at a shift never ended', async () => {
    const [g, h, i] = [-15, -14, -13].map((n) => addIsoWeeks(weeks.current, n)) as [string, string, string];
    const pia = await history.technician('Pia Nordqvist', '6006', 20_00, 10_00);
    const saturday = (week: string) => workweekDays(week, shop)[6]!;
    const sunday = (week: string) => workweekDays(week, shop)[0]!;
    await history.punch(pia, 'shift-in', at(saturday(g), '23:00'));
    await history.punch(pia, 'shift-out', at(sunday(h), '07:30'));
    const kinds = async (week: string) =>
      (
        (await history.as(foreman).get(`/api/exceptions?week=${week}`).expect(200)).body as {
          exceptions: { kind: string; technicianId: number }[];
        }
      ).exceptions
        .filter((exception) => exception.technicianId === pia)
        .map((exception) => exception.kind);
    expect(await kinds(g)).toEqual([]);
    await history.as(owner).post(`/api/pay-weeks/${g}/close`, {}).expect(200);

    await history.punch(pia, 'shift-in', at(saturday(i), '23:00'));
    expect(await kinds(i)).toEqual(['open-shift']);
    await history.as(owner).post(`/api/pay-weeks/${i}/close`, {}).expect(409);
  });

  // Quinn, flat $20, other time $10. P, Monday: 08:00–12:00 on a 4.0 h line, finished then: 4 h × $20 = $80,
  // what payroll is given when P closes. P reopened for a missed Tuesday, 08:00–10:00 on no line: 2 h × $10 =
  // $20 more, $100 in all. Closed again, P keeps the $80 it was paid on and Q, the next open week, carries the
  // $20, by hand.
  it('keeps the figures a week was first closed with when it is closed again, and carries the difference', async () => {
    const [p, q] = [-19, -18].map((n) => addIsoWeeks(weeks.current, n)) as [string, string];
    const quinn = await history.technician('Quinn Harlow', '6007', 20_00, 10_00);
    const day = monday(p);
    await history.workedLine(quinn, 'Replace brake hoses', 4.0, at(day, '08:00'), at(day, '12:00'));
    const closed = (await history.as(owner).post(`/api/pay-weeks/${p}/close`, {}).expect(200)).body as {
      closedAt: string;
    };
    expect(rowOf(await pay(p), quinn)).toMatchObject({ totalCents: 80_00 });

    await history.as(owner).post(`/api/pay-weeks/${p}/reopen`, { reason: 'Tuesday not punched' }).expect(200);
    const tuesday = workweekDays(p, shop)[2]!;
    await history.punch(quinn, 'shift-in', at(tuesday, '08:00'));
    await history.punch(quinn, 'shift-out', at(tuesday, '10:00'));
    const reopened = await pay(p);
    expect(reopened).toMatchObject({ closed: false, firstClosedAt: closed.closedAt });
    expect(rowOf(reopened, quinn)).toMatchObject({ totalCents: 100_00 });

    await history.as(owner).post(`/api/pay-weeks/${p}/close`, {}).expect(200);
    const again = await pay(p);
    expect(again).toMatchObject({ closed: true, firstClosedAt: closed.closedAt });
    expect(rowOf(again, quinn)).toMatchObject({ totalCents: 80_00, payableCents: 80_00 });
    expect((await pay(q)).adjustments).toEqual([
      { technicianId: quinn, forWeek: p, forWeekName: workweekName(p, shop), flaggedHours: 0, cents: 20_00 },
    ]);
  });
});
