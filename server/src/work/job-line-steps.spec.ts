import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import {
  makeVin,
  type BayDto,
  type BoardBay,
  type BoardSnapshot,
  type MyDay,
  type RepairOrderHistoryEntry,
  type RepairOrderSummary,
  type SignInAnswer,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { partsHolds, timers } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { JobLinesService } from './job-lines.service.js';

/** What a change of a line does besides the line: its technicians, its timers, its bay and its car. */
describe(`${JobLinesService.name}: the steps that go with a line's change`, () => {
  let sut: TestApp;
  let advisor: string;
  let foreman: string;
  let owner: string;
  let jo: SignInAnswer;
  let serial = 0;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  const db = () => sut.app.get<Db>(DB);
  /** What a technician writes at Done: the server refuses a technician's Done without it. */
  const words = { cause: 'Worn and out of spec', correction: 'Replaced and road tested' };
  const write = async (titles: string[]) => {
    const n = ++serial;
    return (
      await as(advisor)
        .post('/api/repair-orders', {
          customer: { name: `Ilse Trevanion ${n}`, phone: '(608) 555-0171' },
          vehicle: {
            vin: makeVin(`7RP9TS4DLM${700_000 + n}`),
            year: 2020,
            make: 'Corvane',
            model: 'Altrix',
            odometer: 40_000,
          },
          concern: 'Noise from the front',
          lines: titles.map((title) => ({ title, bookHours: 1 })),
        })
        .expect(201)
    ).body as RepairOrderSummary;
  };
  const newBay = async () =>
    (
      (
        await as(owner)
          .post('/api/bays', { name: `Bay ${40 + ++serial}` })
          .expect(201)
      ).body as BayDto
    ).id;
  const tile = async (bayId: number) =>
    ((await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot).bays.find(
      (bay) => bay.id === bayId,
    )!;
  const place = (lineId: number, bayId: number) =>
    as(foreman).patch(`/api/job-lines/${lineId}`, { technicianId: jo.user.id, bayId }).expect(200);
  const clockOn = (lineId: number) =>
    as(jo.accessToken)
      .post('/api/punches', { id: randomUUID(), kind: 'job-on', jobLineId: lineId })
      .expect(201);
  const joOn = async () =>
    ((await as(jo.accessToken).get('/api/me/day').expect(200)).body as MyDay).openJobLineIds;

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
    foreman = await sut.signIn(DEMO.foreman);
    owner = await sut.signIn(DEMO.owner);
    // Jo is on shift and on no job in the demo shop.
    jo = await sut.badge('1045');
  });
  afterAll(() => sut.close());

  it('holds a line through the foreman’s change as at the kiosk: Jo is clocked off and the parts hold noted', async () => {
    const ro = await write(['Replace front hub bearing']);
    const [line] = ro.lines;
    const bay = await newBay();
    await place(line!.id, bay);
    await clockOn(line!.id);
    expect(await joOn()).toEqual([line!.id]);

    await as(foreman)
      .patch(`/api/job-lines/${line!.id}`, { status: 'held', holdReason: 'parts' })
      .expect(200);
    expect(await joOn()).toEqual([]);
    expect(await tile(bay)).toMatchObject<Partial<BoardBay>>({ state: 'held', clockRunning: false });
    const holds = db().select().from(partsHolds).where(eq(partsHolds.jobLineId, line!.id)).all();
    expect(holds).toHaveLength(1);
  });

  it('ends a line’s running timer when the line is done: the bay shows ready, not a timer', async () => {
    const ro = await write(['Reseal valve cover']);
    const [line] = ro.lines;
    const bay = await newBay();
    await place(line!.id, bay);
    await clockOn(line!.id);
    await as(jo.accessToken)
      .post('/api/timers', { jobLineId: line!.id, kind: 'set-time', durationSeconds: 1800 })
      .expect(201);
    expect((await tile(bay)).state).toBe('timer');

    await as(jo.accessToken)
      .post(`/api/job-lines/${line!.id}/done`, { next: 'ready', ...words })
      .expect(200);
    expect((await tile(bay)).state).toBe('ready');
    const running = db().select().from(timers).where(eq(timers.jobLineId, line!.id)).all();
    expect(running.map((timer) => timer.endedAt)).toEqual([expect.any(Date)]);
  });

  it('moves the bay on when its last open line is cancelled: to its check after work, else to ready', async () => {
    const worked = await write(['Replace wiper motor', 'Replace cabin filter']);
    const [done, declined] = worked.lines;
    const bay = await newBay();
    await place(done!.id, bay);
    await place(declined!.id, bay);
    await clockOn(done!.id);
    await as(jo.accessToken)
      .post(`/api/job-lines/${done!.id}/done`, { next: 'check', ...words })
      .expect(200);
    expect((await tile(bay)).state).toBe('staged');
    await as(advisor)
      .post(`/api/job-lines/${declined!.id}/cancel`, { reason: 'Customer declined at the counter' })
      .expect(200);
    expect((await tile(bay)).state).toBe('check');
    await as(foreman).post(`/api/bays/${bay}/final-check`, {}).expect(200);

    const untouched = await write(['Align the front wheels']);
    const other = await newBay();
    await place(untouched.lines[0]!.id, other);
    await as(advisor)
      .post(`/api/job-lines/${untouched.lines[0]!.id}/cancel`, { reason: 'Customer declined at the counter' })
      .expect(200);
    expect(await tile(other)).toMatchObject({ state: 'ready', repairOrder: { id: untouched.id } });
  });

  it('keeps a bay for the car in it: another RO’s line is refused; the car’s lines moved out take it along', async () => {
    const first = await write(['Replace struts', 'Replace strut mounts']);
    const second = await write(['Replace tie rod ends']);
    const bay = await newBay();
    const next = await newBay();
    await place(first.lines[0]!.id, bay);
    await place(first.lines[1]!.id, bay);

    const refused = await as(foreman)
      .patch(`/api/job-lines/${second.lines[0]!.id}`, { bayId: bay })
      .expect(409);
    expect(refused.body.message).toMatch(new RegExp(`holds RO ${first.number} until it leaves`));
    expect(await tile(bay)).toMatchObject({ state: 'staged', repairOrder: { id: first.id } });

    await as(foreman).patch(`/api/job-lines/${first.lines[0]!.id}`, { bayId: next }).expect(200);
    expect((await tile(bay)).repairOrder).toMatchObject({ id: first.id });
    await as(foreman).patch(`/api/job-lines/${first.lines[1]!.id}`, { bayId: next }).expect(200);
    expect(await tile(bay)).toMatchObject({ state: 'free', repairOrder: null });
    expect(await tile(next)).toMatchObject({ state: 'staged', repairOrder: { id: first.id } });
    await place(second.lines[0]!.id, bay);
    expect(await tile(bay)).toMatchObject({ state: 'staged', repairOrder: { id: second.id } });
  });

  it('refuses a completion time before the line was written: its hours would be flagged in a week before it', async () => {
    const ro = await write(['Replace thermostat']);
    const line = ro.lines[0]!;
    // Written just now, so a week ago is before it.
    const before = new Date(Date.now() - 7 * 24 * 3600_000).toISOString();
    const refused = await as(foreman).patch(`/api/job-lines/${line.id}`, { completedAt: before }).expect(400);
    expect(refused.body.message).toMatch(/^That line was added at .*: it cannot be finished before then$/);
    await as(foreman)
      .patch(`/api/job-lines/${line.id}`, { completedAt: new Date().toISOString() })
      .expect(200);
  });

  it('opens a finished line again as unfinished, and stages its bay for the work', async () => {
    const ro = await write(['Replace thermostat']);
    const [line] = ro.lines;
    const bay = await newBay();
    await place(line!.id, bay);
    await clockOn(line!.id);
    await as(jo.accessToken)
      .post(`/api/job-lines/${line!.id}/done`, { next: 'check', ...words })
      .expect(200);
    expect((await tile(bay)).state).toBe('check');

    const { body } = await as(foreman).patch(`/api/job-lines/${line!.id}`, { status: 'queued' }).expect(200);
    expect(body).toMatchObject({ status: 'queued', completedAt: null, completedBy: null, signOff: null });
    expect(await tile(bay)).toMatchObject({ state: 'staged', repairOrder: { id: ro.id } });
    const history = (await as(advisor).get(`/api/repair-orders/${ro.id}/history`).expect(200))
      .body as RepairOrderHistoryEntry[];
    expect(history.map((entry) => entry.text)).toContain(
      'Line 1 “Replace thermostat” opened again: no longer done',
    );
  });

  it('leaves the lines of a picked-up RO as they were: a change or an edit is refused', async () => {
    const ro = await write(['Replace battery']);
    const [line] = ro.lines;
    await place(line!.id, await newBay());
    await clockOn(line!.id);
    await as(jo.accessToken)
      .post(`/api/job-lines/${line!.id}/done`, { next: 'ready', ...words })
      .expect(200);
    await as(advisor).post(`/api/repair-orders/${ro.id}/close`).expect(200);

    const reopened = await as(foreman).patch(`/api/job-lines/${line!.id}`, { status: 'queued' }).expect(409);
    expect(reopened.body.message).toMatch(/repair order is closed/);
    await as(advisor).patch(`/api/job-lines/${line!.id}/details`, { bookHours: 2 }).expect(409);
    const after = (await as(advisor).get(`/api/repair-orders/${ro.id}`).expect(200))
      .body as RepairOrderSummary;
    expect(after.lines[0]).toMatchObject({ status: 'done', bookHours: 1 });
  });
});
