import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import {
  workweekOf,
  type CorrectionPreview,
  type ExceptionList,
  type HeldPunchDto,
  type PunchDto,
  type ShopSettings,
  type Timecard,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog } from '../db/schema/index.js';
import { shopHistory, type ShopHistory } from '../test-support/shop-history.js';
import { oneWeekEnd } from '../test-support/one-week.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { PunchesService } from './punches.service.js';

const HOUR = 3600_000;

/** A punch that arrives late never silently voids counted ones: it is held, or refused with their names. */
describe(`${PunchesService.name}: late punches`, () => {
  let sut: TestApp;
  let owner: string;
  let foreman: string;
  let history: ShopHistory;
  let max: number;
  let kiosk: string;
  let line: number;
  let shop: ShopSettings;
  /**
   * One clock for the whole file, so hand-worked durations come out exact however slow the machine. Set in
   * `beforeAll`, once the shop's workweek is known.
   */
  let start: number;
  const ago = (hours: number) => new Date(start - hours * HOUR).toISOString();
  /** The shop week of the punches made here, whatever the hour the test runs: all of them lie in it. */
  const week = () => workweekOf(new Date(start - HOUR), shop);
  const punch = (body: object, token = kiosk) =>
    history.as(token).post('/api/punches', { id: randomUUID(), ...body });
  const card = async (technicianId = max) =>
    (await history.as(owner).get(`/api/timecards?technicianId=${technicianId}&week=${week()}`).expect(200))
      .body as Timecard;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
    history = shopHistory(sut, { owner, foreman });
    shop = (await history.as(owner).get('/api/shop').expect(200)).body as ShopSettings;
    // The scenario reaches 7 h back from `start`. When it is moved before the week began, the kiosk
    // punches (at most 4 h before `start`) stay within the 12 h a kiosk punch may be late.
    start = oneWeekEnd(7 * HOUR, shop);
    max = await history.technician('Max Dorrance', '7001', 20_00, 10_00);
    kiosk = (await sut.badge('7001')).accessToken;
    line = history.line('Replace brake hoses', 1.5, max, new Date(start - 5 * HOUR));
    await punch({ kind: 'shift-in', at: ago(4) }).expect(201);
    await punch({ kind: 'job-on', jobLineId: line, at: ago(3) }).expect(201);
    await punch({ kind: 'job-off', jobLineId: line, at: ago(1) }).expect(201);
  });
  afterAll(() => sut.close());

  it('refuses an office punch that would displace counted ones, naming them', async () => {
    const refused = await punch({ kind: 'shift-out', at: ago(2), technicianId: max }, foreman).expect(409);
    expect(refused.body.message).toMatch(
      /^That punch would leave the clock off at \w{3}, \w{3} \d{1,2}, \d{1,2}:\d{2} [ap]m \(RO T901 · Replace brake hoses\) not counted: ask the foreman to correct the timecard$/,
    );
  });

  // The issue's example: an offline tablet uploads a shift-out stamped before the day's last job punches.
  it('holds a late kiosk punch that would displace counted ones: the counted hours do not drop', async () => {
    const before = await card();
    const id = randomUUID();
    const held = await punch({ id, kind: 'shift-out', at: ago(3.5) }).expect(202);
    expect(held.body).toMatchObject({ id, review: 'pending', kind: 'shift-out' });
    expect((held.body as HeldPunchDto).displaces.map((p) => p.kind)).toEqual(['job-on', 'job-off']);
    // The rest of the offline replay waits behind it.
    const behind = await punch({ kind: 'break-start', breakKind: 'rest', at: ago(3.4) }).expect(202);
    expect(behind.body.heldBecause).toMatch(/came in late behind a punch held for review$/);
    expect((await punch({ id, kind: 'shift-out', at: ago(3.5) }).expect(200)).body).toMatchObject({
      review: 'pending',
    });

    const after = await card();
    expect(after.totals.clockedSeconds).toBe(before.totals.clockedSeconds);
    expect(after.totals.clockedSeconds).toBe(2 * 3600);
    expect(after.totals.attendanceSeconds).toBeGreaterThanOrEqual(before.totals.attendanceSeconds);
    expect(after.held.map((h) => h.id)).toEqual([id, behind.body.id]);
    expect(after.exceptions.filter((e) => e.kind === 'held-punch').map((e) => e.punchId)).toEqual([
      id,
      behind.body.id,
    ]);
    const list = (await history.as(foreman).get(`/api/exceptions?week=${week()}`).expect(200))
      .body as ExceptionList;
    expect(list.exceptions.filter((e) => e.technicianId === max && e.resolution === null)).toHaveLength(2);
  });

  it('lets the foreman reject one held punch and accept another, voiding what it displaces, audited', async () => {
    const [shiftOut, rest] = (await card()).held;
    await history.as(kiosk).post(`/api/punches/held/${rest!.id}/reject`, { reason: 'not mine' }).expect(403);
    await history.as(foreman).post(`/api/punches/held/${rest!.id}/reject`, {}).expect(400);
    await history
      .as(foreman)
      .post(`/api/punches/held/${rest!.id}/reject`, { reason: 'Tapped by mistake' })
      .expect(200);
    const accepted = await history
      .as(foreman)
      .post(`/api/punches/held/${shiftOut!.id}/accept`, {
        reason: 'Max left early; the job punches were a colleague’s',
      })
      .expect(200);
    expect(accepted.body).toMatchObject({
      review: 'accepted',
      resolution: 'Max left early; the job punches were a colleague’s',
    });
    await history
      .as(foreman)
      .post(`/api/punches/held/${shiftOut!.id}/accept`, { reason: 'again' })
      .expect(409);

    const after = await card();
    expect(after.totals.clockedSeconds).toBe(0);
    expect(after.totals.attendanceSeconds).toBe(0.5 * 3600);
    expect(after.anomalies).toEqual([]);
    const voided = after.punches.filter((p) => p.kind.startsWith('job-') && !p.voids);
    expect(voided.every((p) => p.supersededBy !== null)).toBe(true);
    expect(after.exceptions.filter((e) => e.kind === 'held-punch').map((e) => e.resolution?.note)).toEqual([
      'Accepted: Max left early; the job punches were a colleague’s',
      'Rejected: Tapped by mistake',
    ]);
    const db = sut.app.get<Db>(DB);
    const voids = db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'punch'), eq(auditLog.action, 'void')))
      .all();
    expect(voids.map((entry) => entry.entityId).sort()).toEqual(voided.map((p) => p.id).sort());
  });

  it('previews what a correction would displace and saves it only once those punches are confirmed', async () => {
    const noa = await history.technician('Noa Castillo', '7002', 20_00, 10_00);
    const job = history.line('Replace fuel filter', 0.8, noa, new Date(start - 7 * HOUR));
    await history.punch(noa, 'shift-in', new Date(ago(6)));
    const jobOn = (await history.punch(noa, 'job-on', new Date(ago(5)), job)).body as PunchDto;
    const jobOff = (await history.punch(noa, 'job-off', new Date(ago(4)), job)).body as PunchDto;
    await history.punch(noa, 'shift-out', new Date(ago(3)));

    // A meal added at 5½ h ago would leave the clock-on (on a break) and so the clock-off without a job.
    const correction = {
      technicianId: noa,
      kind: 'break-start',
      breakKind: 'meal',
      at: ago(5.5),
      reason: 'Paper sheet shows lunch',
    };
    const preview = (
      await history.as(foreman).post('/api/timecards/corrections?preview=true', correction).expect(200)
    ).body as CorrectionPreview;
    expect(preview.refusal).toBeNull();
    expect(preview.displaces.map((p) => p.id)).toEqual([jobOn.id, jobOff.id]);
    expect(preview.displaces[0]!.words).toMatch(/^the clock on at .* \(RO T902 · Replace fuel filter\)$/);
    expect((await card(noa)).punches).toHaveLength(4);

    const unconfirmed = await history.as(foreman).post('/api/timecards/corrections', correction).expect(409);
    expect(unconfirmed.body.message).toMatch(
      /^That correction would leave the clock on .* check them in the preview and confirm$/,
    );
    await history
      .as(foreman)
      .post('/api/timecards/corrections', { ...correction, displaces: [jobOn.id, jobOff.id] })
      .expect(201);
    const after = await card(noa);
    expect(after.anomalies).toEqual([]);
    expect(after.totals.clockedSeconds).toBe(0);
    const voiding = after.punches.filter((p) => p.voids).map((p) => [p.supersedes, p.id, p.reason]);
    expect(voiding).toEqual([
      [jobOn.id, expect.any(String), 'Displaced by a correction: Paper sheet shows lunch'],
      [jobOff.id, expect.any(String), 'Displaced by a correction: Paper sheet shows lunch'],
    ]);
    expect(after.punches.find((p) => p.id === jobOn.id)!.supersededBy).toBe(voiding[0]![1]);
  });

  // 29 CFR 785.19(a): a meal under 30 minutes is ordinarily not a bona fide meal period; the ledger counts it
  // as paid rest and lists it, and the foreman may accept it as it is.
  it('refuses to clock anyone on a line before it was written, at the kiosk or by correction', async () => {
    const job = history.line('Replace wiper motor', 0.7, max, new Date(start - 2 * HOUR));
    const early = { technicianId: max, kind: 'job-on', jobLineId: job, at: ago(2.5) };
    const correction = { ...early, reason: 'Paper sheet' };
    const refused = await history.as(foreman).post('/api/timecards/corrections', correction).expect(400);
    expect(refused.body.message).toMatch(
      /^That line was added at \w{3}, \w{3} \d{1,2}, \d{1,2}:\d{2} [ap]m: no one can be clocked on it before then$/,
    );
    await punch({ kind: 'job-on', jobLineId: job, at: ago(2.5) }).expect(400);
    const before = await card();
    expect(before.punches.some((p) => p.jobLineId === job)).toBe(false);
  });

  it('lists a short meal for the foreman, who may mark it reviewed with a note', async () => {
    const ida = await history.technician('Ida Marchetti', '7003', 20_00, 10_00);
    await history.punch(ida, 'shift-in', new Date(ago(6)));
    await history.punch(ida, 'break-start', new Date(ago(4)));
    await history.punch(ida, 'break-end', new Date(start - 3 * HOUR - 40 * 60_000));
    await history.punch(ida, 'shift-out', new Date(ago(2)));
    const mine = async () =>
      (
        (await history.as(foreman).get(`/api/exceptions?week=${week()}`).expect(200)).body as ExceptionList
      ).exceptions.filter((e) => e.technicianId === ida);
    const [short] = await mine();
    expect(short).toMatchObject({ kind: 'short-meal', resolution: null });
    expect(short!.text).toMatch(
      /^Meal break at .* lasted 20 min, under the shop's 30-minute minimum: counted as paid rest$/,
    );
    expect((await card(ida)).totals.attendanceSeconds).toBe(4 * 3600);

    await history
      .as(foreman)
      .post('/api/exceptions/reviews', { key: 'short-meal:nothing', note: 'ok' })
      .expect(400);
    await history.as(foreman).post('/api/exceptions/reviews', { key: short!.key, note: 'x' }).expect(400);
    await history
      .as(foreman)
      .post('/api/exceptions/reviews', { key: short!.key, note: 'Ida asked to cut lunch short today' })
      .expect(200);
    expect((await mine())[0]!.resolution).toMatchObject({
      by: 'Theo Varga',
      note: 'Reviewed: Ida asked to cut lunch short today',
    });
  });

  it('holds the rest of an offline replay behind its held punch even where it needs that punch, losing none', async () => {
    const eli = await history.technician('Eli Brannock', '7004', 20_00, 10_00);
    const tablet = (await sut.badge('7004')).accessToken;
    const job = history.line('Replace drive belt', 1.0, eli, new Date(start - 7 * HOUR));
    // The foreman added Eli's shift-in from the paper sheet while the tablet was offline.
    await history.punch(eli, 'shift-in', new Date(ago(2)));
    const own = { shiftIn: randomUUID(), jobOn: randomUUID(), jobOff: randomUUID() };
    await punch({ id: own.shiftIn, kind: 'shift-in', at: ago(3) }, tablet).expect(202);
    // Off shift as counted, so taken alone these would be refused: they wait behind the held shift-in.
    const jobOn = await punch({ id: own.jobOn, kind: 'job-on', jobLineId: job, at: ago(2.5) }, tablet).expect(
      202,
    );
    expect(jobOn.body.heldBecause).toMatch(/came in late behind a punch held for review$/);
    await punch({ id: own.jobOff, kind: 'job-off', jobLineId: job, at: ago(1.5) }, tablet).expect(202);
    expect((await card(eli)).held.map((h) => h.id)).toEqual([own.shiftIn, own.jobOn, own.jobOff]);

    await history
      .as(foreman)
      .post(`/api/punches/held/${own.shiftIn}/accept`, {
        reason: 'Eli started at the tablet before the sheet',
      })
      .expect(200);
    // The rest of the replay waited behind it, and is accepted with it.
    const after = await card(eli);
    expect(after.held.map((h) => [h.id, h.review])).toEqual([
      [own.shiftIn, 'accepted'],
      [own.jobOn, 'accepted'],
      [own.jobOff, 'accepted'],
    ]);
    // By hand: on the belt from 2½ h to 1½ h before now, one hour.
    expect(after.totals.clockedSeconds).toBe(3600);
  });

  // The end of an offline replay can be seconds old when it arrives: it waits behind the held punch all the
  // same, instead of being refused (a tablet drops a refused punch, and the break would never end).
  it('holds the end of a replay that came in only a moment late behind its held punch, rather than refusing it', async () => {
    const fay = await history.technician('Fay Lindgren', '7006', 20_00, 10_00);
    const tablet = (await sut.badge('7006')).accessToken;
    const job = history.line('Replace wiper motor', 1.0, fay, new Date(start - 7 * HOUR));
    await punch({ kind: 'shift-in', at: ago(3) }, tablet).expect(201);
    await punch({ kind: 'job-on', jobLineId: job, at: ago(2) }, tablet).expect(201);
    // Another tablet, live: the clock-off three minutes ago.
    await punch({ kind: 'job-off', jobLineId: job, at: ago(0.05) }, tablet).expect(201);
    // The offline tablet's replay: a rest from six minutes ago, ended a minute ago.
    const rest = randomUUID();
    await punch({ id: rest, kind: 'break-start', breakKind: 'rest', at: ago(0.1) }, tablet).expect(202);
    const end = await punch({ kind: 'break-end', at: ago(1 / 60) }, tablet).expect(202);
    expect(end.body.heldBecause).toMatch(/came in late behind a punch held for review$/);
    await history
      .as(foreman)
      .post(`/api/punches/held/${rest}/accept`, { reason: 'Rest taken at the other tablet' })
      .expect(200);
    // Accepted together: the rest has its end, and Fay is back on shift, not left on a break.
    const after = await card(fay);
    expect(after.held.map((h) => h.review)).toEqual(['accepted', 'accepted']);
    expect(after.breaks.map((b) => [b.from, b.to, b.open])).toEqual([[ago(0.1), ago(1 / 60), false]]);
  });

  it('judges a held late break with its end, which waited behind it: the clock-on after the break stays', async () => {
    const ada = await history.technician('Ada Quillfeather', '7005', 20_00, 10_00);
    const tablet = (await sut.badge('7005')).accessToken;
    const job = history.line('Replace cabin filter', 0.5, ada, new Date(start - 7 * HOUR));
    await punch({ kind: 'shift-in', at: ago(3) }, tablet).expect(201);
    await punch({ kind: 'job-on', jobLineId: job, at: ago(0.5) }, tablet).expect(201);
    await punch({ kind: 'job-off', jobLineId: job, at: ago(0.25) }, tablet).expect(201);
    // Another tablet's replay: a meal an hour and a half ago, ended half an hour later.
    const meal = await punch({ kind: 'break-start', breakKind: 'meal', at: ago(1.5) }, tablet).expect(202);
    expect((meal.body as HeldPunchDto).displaces.map((p) => p.kind)).toEqual(['job-on', 'job-off']);
    const end = await punch({ kind: 'break-end', at: ago(1) }, tablet).expect(202);

    await history
      .as(foreman)
      .post(`/api/punches/held/${meal.body.id}/accept`, { reason: 'Ada took lunch; the tablet was offline' })
      .expect(200);
    const after = await card(ada);
    expect(after.held.map((h) => [h.id, h.review])).toEqual([
      [meal.body.id, 'accepted'],
      [end.body.id, 'accepted'],
    ]);
    // By hand: the meal ran from 1½ h to 1 h before now (30 min, a bona fide meal), and the job from ½ h
    // to ¼ h before now (15 min) after it, still counted.
    expect(after.totals.mealBreakSeconds).toBe(1800);
    expect(after.totals.clockedSeconds).toBe(900);
    expect(after.punches.filter((p) => p.voids)).toEqual([]);
  });
});
