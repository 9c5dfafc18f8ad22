import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { inArray } from 'drizzle-orm';
import {
  workweekOf,
  type CorrectionPreview,
  type LabourReport,
  type PunchKind,
  type ShopSettings,
  type Timecard,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { jobLines, punches } from '../db/schema/index.js';
import { shopHistory, type ShopHistory } from '../test-support/shop-history.js';
import { oneWeekEnd } from '../test-support/one-week.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { TimecardsService } from './timecards.service.js';

const HOUR = 3600_000;

describe(TimecardsService.name, () => {
  let sut: TestApp;
  let owner: string;
  let technicianId: number;
  let techToken: string;
  let history: ShopHistory;
  /** Kit's missed 4 h shift, all in one shop week, and that week (set in `beforeAll`). */
  let shift: { start: Date; end: Date };
  let week: string;
  const card = async (token = owner, query = `technicianId=${technicianId}&week=${week}`) =>
    (await sut.http().get(`/api/timecards?${query}`).auth(token, { type: 'bearer' }).expect(200))
      .body as Timecard;
  const addTechnician = async (name: string, badge: string) =>
    (
      await sut
        .http()
        .post('/api/users')
        .auth(owner, { type: 'bearer' })
        .send({ name, role: 'technician', badge, pin: '4321' })
        .expect(201)
    ).body as { id: number };
  /** Lines of the technician's own, written three hours ago, before any punch a test adds. */
  const linesOf = (technicianId: number, count: number) =>
    Array.from({ length: count }, (_, i) =>
      history.line(`Line ${i + 1}`, 1.0, technicianId, new Date(Date.now() - 3 * HOUR)),
    );
  const correct = (body: object) =>
    sut
      .http()
      .post('/api/timecards/corrections')
      .auth(owner, { type: 'bearer' })
      .send({ technicianId, ...body });

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    history = shopHistory(sut, { owner, foreman: await sut.signIn(DEMO.foreman) });
    await addTechnician('Kit Marsh', '3001');
    const kit = await sut.badge('3001');
    technicianId = kit.user.id;
    techToken = kit.accessToken;
    const shop = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
      .body as ShopSettings;
    const end = oneWeekEnd(5 * HOUR, shop) - HOUR;
    shift = { start: new Date(end - 4 * HOUR), end: new Date(end) };
    week = workweekOf(shift.end, shop);
  });
  afterAll(() => sut.close());

  it('adds a missed shift with a reason and counts it; the audit trail says who and why', async () => {
    const { start, end } = shift;
    await correct({ kind: 'shift-in', at: start.toISOString(), reason: 'Forgot to punch in' }).expect(201);
    await correct({ kind: 'shift-out', at: end.toISOString(), reason: 'Forgot to punch out' }).expect(201);
    const timecard = await card();
    expect(timecard.totals.attendanceSeconds).toBe(4 * 3600);
    expect(timecard.audit.map((entry) => entry.action)).toEqual(['add-missed', 'add-missed']);
    expect(timecard.audit[0]).toMatchObject({ actor: 'Rosa Pellman' });
  });

  it('supersedes a punch without editing it: both stay on record, the correction counts', async () => {
    const before = await card();
    const shiftOut = before.punches.find((p) => p.kind === 'shift-out')!;
    const earlier = new Date(new Date(shiftOut.at).getTime() - 1800_000).toISOString();
    const { body } = await correct({
      punchId: shiftOut.id,
      kind: 'shift-out',
      at: earlier,
      reason: 'Left at 30 minutes earlier',
    }).expect(201);
    const after = await card();
    expect(after.totals.attendanceSeconds).toBe(3.5 * 3600);
    expect(after.punches.find((p) => p.id === shiftOut.id)).toMatchObject({
      at: shiftOut.at,
      supersededBy: body.id,
    });
    await correct({ punchId: shiftOut.id, kind: 'shift-out', at: earlier, reason: 'again' }).expect(409);
  });

  it('requires a reason and refuses corrections in the future', async () => {
    await correct({ kind: 'shift-in', at: new Date().toISOString() }).expect(400);
    await correct({
      kind: 'shift-in',
      at: new Date(Date.now() + 3600_000).toISOString(),
      reason: 'typo',
    }).expect(400);
  });

  it('shows a technician their own timecard only', async () => {
    expect((await card(techToken, '')).technician.id).toBe(technicianId);
    await sut
      .http()
      .get(`/api/timecards?technicianId=${technicianId - 1}`)
      .auth(techToken, { type: 'bearer' })
      .expect(403);
  });

  it('holds a correction dated before a change of the jobs-at-once limit to the limit of its moment', async () => {
    const newcomer = await addTechnician('Ada Fenwick', '3003');
    const [first, second] = linesOf(newcomer.id, 2);
    const ago = (minutes: number) => new Date(Date.now() - minutes * 60_000).toISOString();
    const shop = () => sut.http().patch('/api/shop').auth(owner, { type: 'bearer' });
    await shop().send({ maxConcurrentJobs: 2 }).expect(200);
    try {
      const add = (body: object) =>
        correct({ technicianId: newcomer.id, reason: 'Punched on paper', ...body }).expect(201);
      await add({ kind: 'shift-in', at: ago(30) });
      await add({ kind: 'job-on', jobLineId: first, at: ago(25) });
      const switched = ago(20);
      await add({ kind: 'job-on', jobLineId: second, at: switched });
      const week = workweekOf(new Date(), (await shop().send({}).expect(200)).body as ShopSettings);
      const { punches } = await card(owner, `technicianId=${newcomer.id}&week=${week}`);
      // One job at a time until a moment ago: the second clock-on closed the first line where it happened.
      expect(punches.filter((p) => p.kind === 'job-off')).toEqual([
        expect.objectContaining({ jobLineId: first, at: switched }),
      ]);
    } finally {
      await shop().send({ maxConcurrentJobs: 1 }).expect(200);
    }
  });

  // One job at a time: on line A from 25 min ago, switched to B 15 min ago. A missed clock-on onto C 20 min
  // ago closes A then, and B's clock-on, on record, closes C: C counts 5 min, and only B is open.
  it('closes a clock-on added in the past where the next clock-on on record switched lines', async () => {
    const newcomer = await addTechnician('Dov Kessler', '3005');
    const [a, b, c] = linesOf(newcomer.id, 3);
    const at = (minutes: number) => new Date(Math.floor(Date.now() / 60_000) * 60_000 - minutes * 60_000);
    const add = (body: object) => correct({ technicianId: newcomer.id, reason: 'Punched on paper', ...body });
    await add({ kind: 'shift-in', at: at(30).toISOString() }).expect(201);
    await add({ kind: 'job-on', jobLineId: a, at: at(25).toISOString() }).expect(201);
    await add({ kind: 'job-on', jobLineId: b, at: at(15).toISOString() }).expect(201);
    const missed = { kind: 'job-on', jobLineId: c, at: at(20).toISOString() };
    const preview = await sut
      .http()
      .post('/api/timecards/corrections?preview=true')
      .auth(owner, { type: 'bearer' })
      .send({ technicianId: newcomer.id, reason: 'Punched on paper', ...missed })
      .expect(200);
    const { displaces, withIt } = preview.body as CorrectionPreview;
    // It says what it records with it: A's clock-off where it begins, and its own where B's clock-on is.
    expect(withIt.map((p) => [p.kind, p.at])).toEqual([
      ['job-off', at(20).toISOString()],
      ['job-off', at(15).toISOString()],
    ]);
    await add({ ...missed, displaces: displaces.map((p) => p.id) }).expect(201);
    const settings = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
      .body as ShopSettings;
    const { jobs } = await card(owner, `technicianId=${newcomer.id}&week=${workweekOf(at(0), settings)}`);
    expect(jobs.map((job) => [job.jobLineId, job.from, job.open ? null : job.to])).toEqual([
      [a, at(25).toISOString(), at(20).toISOString()],
      [c, at(20).toISOString(), at(15).toISOString()],
      [b, at(15).toISOString(), null],
    ]);
    // Clocked on by corrections, the lines are being worked, no longer waiting in the queue.
    const statuses = sut.app
      .get<Db>(DB)
      .select({ status: jobLines.status })
      .from(jobLines)
      .where(inArray(jobLines.id, [a!, b!, c!]))
      .all();
    expect(statuses.map((line) => line.status)).toEqual(['working', 'working', 'working']);
  });

  it('credits each of two lines worked at once with its share of the time they shared', async () => {
    const newcomer = await addTechnician('Cy Aldana', '3004');
    const [first, second] = linesOf(newcomer.id, 2);
    const settings = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
      .body as ShopSettings;
    expect(settings.concurrentSplit).toBe('even');
    const end = oneWeekEnd(HOUR, settings);
    const punch = (kind: PunchKind, minutesBeforeEnd: number, jobLineId: number | null = null) => ({
      id: randomUUID(),
      technicianId: newcomer.id,
      kind,
      jobLineId,
      at: new Date(end - minutesBeforeEnd * 60_000),
      recordedAt: new Date(),
      recordedBy: newcomer.id,
    });
    // Written straight to the table, as two jobs at once were allowed then.
    sut.app
      .get<Db>(DB)
      .insert(punches)
      .values([
        punch('shift-in', 60),
        punch('job-on', 50, first),
        punch('job-on', 40, second),
        punch('job-off', 20, first),
        punch('job-off', 10, second),
        punch('shift-out', 5),
      ])
      .run();
    const { jobs, totals } = await card(
      owner,
      `technicianId=${newcomer.id}&week=${workweekOf(new Date(end), settings)}`,
    );
    // By hand: each line ran 30 min, 20 of them together. Split evenly, each is credited 10 min alone
    // and 10 of the 20 shared: 20 min, and the two add up to the 40 min on jobs.
    expect(jobs.map((job) => [job.jobLineId, job.seconds, job.countedSeconds])).toEqual([
      [first, 1800, 1200],
      [second, 1800, 1200],
    ]);
    expect(totals.clockedSeconds).toBe(2400);
  });

  // One job at a time. On shift 60 to 10 min ago, on line A from 50 min ago, with a stray tap onto B 40 min
  // ago (it recorded A's clock-off then) and back onto A 30 min ago (B's clock-off then), off A 20 min ago.
  // By hand: taking the stray clock-on out takes A's clock-off it recorded with it; B's clock-off and the
  // second clock-on onto A no longer fit and go once confirmed. A then ran 50 to 20 min ago: 30 min on jobs.
  it('takes a wrong punch out with what it recorded and, confirmed, what it displaces; all stay on record', async () => {
    const newcomer = await addTechnician('Iva Brandt', '3006');
    const [a, b] = linesOf(newcomer.id, 2);
    const at = (minutes: number) =>
      new Date(Math.floor(Date.now() / 60_000) * 60_000 - minutes * 60_000).toISOString();
    for (const body of [
      { kind: 'shift-in', at: at(60) },
      { kind: 'job-on', jobLineId: a, at: at(50) },
      { kind: 'job-on', jobLineId: b, at: at(40) },
      { kind: 'job-on', jobLineId: a, at: at(30) },
      { kind: 'job-off', jobLineId: a, at: at(20) },
      { kind: 'shift-out', at: at(10) },
    ])
      await correct({ technicianId: newcomer.id, reason: 'Punched on paper', ...body }).expect(201);
    const settings = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
      .body as ShopSettings;
    const query = `technicianId=${newcomer.id}&week=${workweekOf(new Date(at(10)), settings)}`;
    const { punches } = await card(owner, query);
    const find = (kind: PunchKind, line: number | undefined, minutes: number) =>
      punches.find((p) => p.kind === kind && p.jobLineId === line && p.at === at(minutes))!;
    const stray = find('job-on', b, 40);
    const recordedWithIt = find('job-off', a, 40);
    const displaced = [find('job-on', a, 30), find('job-off', b, 30)];
    const takeOut = (body: object, preview = false) =>
      sut
        .http()
        .post(`/api/timecards/voids${preview ? '?preview=true' : ''}`)
        .auth(owner, { type: 'bearer' })
        .send({ technicianId: newcomer.id, punchId: stray.id, reason: 'Tapped the wrong line', ...body });

    const preview = (await takeOut({}, true).expect(200)).body as CorrectionPreview;
    expect(preview.refusal).toBeNull();
    expect(preview.displaces.map((p) => p.id).sort()).toEqual(displaced.map((p) => p.id).sort());
    expect(preview.withIt).toEqual([expect.objectContaining({ id: recordedWithIt.id, kind: 'job-off' })]);
    // A stray tap that only moved time between lines changes no total; the shift start taken out would
    // take the whole 50 min on shift and its 30 min on jobs off the card.
    expect(preview.change).toEqual({ attendanceSeconds: 0, clockedSeconds: 0 });
    const shiftIn = punches.find((p) => p.kind === 'shift-in')!;
    const whole = (await takeOut({ punchId: shiftIn.id }, true).expect(200)).body as CorrectionPreview;
    expect(whole.change).toEqual({ attendanceSeconds: -50 * 60, clockedSeconds: -30 * 60 });
    await takeOut({}).expect(409);
    await takeOut({ reason: '' }).expect(400);
    const { body: voiding } = await takeOut({ displaces: displaced.map((p) => p.id) }).expect(201);
    expect(voiding).toMatchObject({ supersedes: stray.id, voids: true, reason: 'Tapped the wrong line' });

    const after = await card(owner, query);
    expect(after.totals).toMatchObject({ attendanceSeconds: 50 * 60, clockedSeconds: 30 * 60 });
    expect(after.jobs.map((job) => [job.jobLineId, job.from, job.to])).toEqual([[a, at(50), at(20)]]);
    for (const punch of [stray, recordedWithIt, ...displaced])
      expect(after.punches.find((p) => p.id === punch.id)?.supersededBy).toEqual(expect.any(String));
    expect(after.audit.filter((entry) => entry.action === 'void')).toHaveLength(3);
    await takeOut({ displaces: displaced.map((p) => p.id) }).expect(409);
    // B's only clock-on is gone: nobody worked it, so it waits in the queue again; A is still being worked.
    const statuses = sut.app
      .get<Db>(DB)
      .select({ id: jobLines.id, status: jobLines.status })
      .from(jobLines)
      .where(inArray(jobLines.id, [a!, b!]))
      .all();
    expect(new Map(statuses.map((line) => [line.id, line.status]))).toEqual(
      new Map([
        [a, 'working'],
        [b, 'queued'],
      ]),
    );
    // Its card still names the line of each punch taken out.
    expect(after.lines.map((line) => line.jobLineId).sort()).toEqual([a, b].sort());
  });

  // Three shifts of 1 h 0 min 0.5 s on three days: 10,801.5 s, which is 10,802 whole seconds rounded once
  // (half up). Rounding each day alone would give 3 × 3,601 = 10,803 s, a second the week never had.
  it('gives days in whole seconds that add up to the week, the labour report’s attendance', async () => {
    const newcomer = await addTechnician('Ola Renvik', '3007');
    const settings = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
      .body as ShopSettings;
    const end = oneWeekEnd(3 * 24 * HOUR, settings);
    const punch = (kind: PunchKind, at: number) => ({
      id: randomUUID(),
      technicianId: newcomer.id,
      kind,
      at: new Date(at),
      recordedAt: new Date(),
      recordedBy: newcomer.id,
    });
    sut.app
      .get<Db>(DB)
      .insert(punches)
      .values(
        [1, 2, 3].flatMap((daysBack) => {
          const start = end - daysBack * 24 * HOUR + HOUR;
          return [punch('shift-in', start), punch('shift-out', start + 3600_500)];
        }),
      )
      .run();
    const week = workweekOf(new Date(end), settings);
    const { days, totals } = await card(owner, `technicianId=${newcomer.id}&week=${week}`);
    expect(totals.attendanceSeconds).toBe(10_802);
    expect(days.reduce((sum, day) => sum + day.attendanceSeconds, 0)).toBe(10_802);
    const labour = (
      await sut.http().get(`/api/reports/labour?week=${week}`).auth(owner, { type: 'bearer' }).expect(200)
    ).body as LabourReport;
    // 10,802 s is 3.000 555… h: 3.0006 to 4 decimals.
    expect(labour.technicians.find((t) => t.technicianId === newcomer.id)?.attendanceHours).toBe(3.0006);
  });

  it('flags a shift still open from an earlier day', async () => {
    const newcomer = await addTechnician('Bo Lindell', '3002');
    const yesterday = new Date(Date.now() - 26 * 3600_000).toISOString();
    await correct({
      technicianId: newcomer.id,
      kind: 'shift-in',
      at: yesterday,
      reason: 'Punched in on paper',
    }).expect(201);
    const week = workweekOf(new Date(), {
      timeZone: 'America/Chicago',
      workweekStartDay: 0,
      workweekStartHour: 0,
    });
    const { body } = await sut
      .http()
      .get(`/api/timecards?technicianId=${newcomer.id}&week=${week}`)
      .auth(owner, { type: 'bearer' })
      .expect(200);
    // The day and time as people read them in the shop's zone, not a date key.
    const day = new Intl.DateTimeFormat('en-US', {
      timeZone: 'America/Chicago',
      weekday: 'short',
      month: 'short',
      day: 'numeric',
    }).format(new Date(yesterday));
    expect((body as Timecard).flags).toContainEqual(
      expect.stringMatching(
        new RegExp(`^Still on shift since ${day}, \\d{1,2}:\\d{2} [ap]m: a shift end may be missing$`),
      ),
    );
  });
});
