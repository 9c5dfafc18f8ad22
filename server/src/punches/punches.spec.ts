import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, beforeEach, describe, expect, it } from 'vitest';
import type { MyDay, SignInAnswer } from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { PunchesService } from './punches.service.js';

describe(PunchesService.name, () => {
  let sut: TestApp;
  let tech: SignInAnswer;
  const punch = (body: Record<string, unknown>, token = tech.accessToken) =>
    sut
      .http()
      .post('/api/punches')
      .auth(token, { type: 'bearer' })
      .send({ id: randomUUID(), ...body });
  const myDay = async (token = tech.accessToken) =>
    (await sut.http().get('/api/me/day').auth(token, { type: 'bearer' }).expect(200)).body as MyDay;

  beforeAll(async () => {
    sut = await startTestApp();
  });
  afterAll(() => sut.close());
  beforeEach(async () => {
    // Jo is idle on shift in the demo shop; shift her out so each test starts off shift.
    tech = await sut.badge('1045');
    if ((await myDay()).shift.status !== 'off') await punch({ kind: 'shift-out' }).expect(201);
  });

  it('records a punch once: 201, then 200 with the stored punch for the same id', async () => {
    const id = randomUUID();
    const first = await punch({ id, kind: 'shift-in' }).expect(201);
    const again = await punch({ id, kind: 'shift-in' }).expect(200);
    expect(again.body).toEqual(first.body);
    expect((await myDay()).shift.status).toBe('on-shift');
  });

  it('refuses impossible punches with 409 and a reason in plain words', async () => {
    const day = await myDay();
    const line = day.lines[0]!;
    const refused = await punch({ kind: 'job-on', jobLineId: line.id }).expect(409);
    expect(refused.body.message).toBe('You are not on shift');
    await punch({ kind: 'break-end' }).expect(409);
    await punch({ kind: 'shift-in' }).expect(201);
    await punch({ kind: 'shift-in' }).expect(409);
  });

  it('keeps the time an offline punch was tapped, within 12 hours, and refuses future ones', async () => {
    const owner = await sut.signIn(DEMO.owner);
    await sut
      .http()
      .post('/api/users')
      .auth(owner, { type: 'bearer' })
      .send({ name: 'Ada Newhire', role: 'technician', badge: '2001', pin: '4321' })
      .expect(201);
    tech = await sut.badge('2001');
    const tapped = new Date(Date.now() - 20 * 60_000).toISOString();
    const { body } = await punch({ kind: 'shift-in', at: tapped }).expect(201);
    expect(body.at).toBe(tapped);
    await punch({ kind: 'break-start', at: new Date(Date.now() + 3600_000).toISOString() }).expect(400);
    await punch({ kind: 'break-start', at: new Date(Date.now() - 13 * 3600_000).toISOString() }).expect(400);
  });

  it('validates the body: a job punch needs a line, ids are uuids', async () => {
    const { body } = await punch({ kind: 'job-on' }).expect(400);
    expect(body.issues[0].path).toEqual(['jobLineId']);
    await sut
      .http()
      .post('/api/punches')
      .auth(tech.accessToken, { type: 'bearer' })
      .send({ id: 'x', kind: 'shift-in' })
      .expect(400);
  });

  it('lets the foreman punch for a technician, never a technician for another', async () => {
    const foreman = await sut.signIn(DEMO.foreman);
    await punch({ kind: 'shift-in', technicianId: tech.user.id + 1 }).expect(403);
    await punch({ kind: 'shift-in', technicianId: tech.user.id }, foreman).expect(201);
    expect((await myDay()).shift.status).toBe('on-shift');
    // Refused, in words about the technician for the foreman and to the technician herself.
    const again = await punch({ kind: 'shift-in', technicianId: tech.user.id }, foreman).expect(409);
    expect(again.body.message).toBe('Jo Whitfield is already on shift');
    expect((await punch({ kind: 'shift-in' }).expect(409)).body.message).toBe('You are already on shift');
  });

  it('clocks on a line and the wall hears about it at once', async () => {
    const owner = await sut.signIn(DEMO.owner);
    const wall = sut.connect(owner);
    await nextEvent(wall, 'board.snapshot');
    const line = (await myDay()).lines[0]!;
    await punch({ kind: 'shift-in' }).expect(201);
    const bayUpdate = nextEvent(
      wall,
      'bay.updated',
      ({ bay }) => bay.jobLine?.id === line.id && bay.state === 'working',
    );
    const recorded = nextEvent(wall, 'punch.recorded');
    await punch({ kind: 'job-on', jobLineId: line.id }).expect(201);
    expect((await recorded).punch.kind).toBe('job-on');
    expect((await bayUpdate).bay.technicians.map((t) => t.name)).toContain('Jo W.');
    expect((await myDay()).openJobLineIds).toEqual([line.id]);
  });

  it('records the job-off a switch implies, so a later jobs-at-once limit leaves the past as counted', async () => {
    const [foreman, owner] = [await sut.signIn(DEMO.foreman), await sut.signIn(DEMO.owner)];
    const board = (await sut.http().get('/api/board').auth(foreman, { type: 'bearer' }).expect(200)).body as {
      queue: { jobLineId: number }[];
    };
    const [first, second] = board.queue.map((line) => line.jobLineId);
    const forJo = (body: Record<string, unknown>) =>
      punch({ technicianId: tech.user.id, ...body }, foreman).expect(201);
    await forJo({ kind: 'shift-in' });
    await forJo({ kind: 'job-on', jobLineId: first });
    const wall = sut.connect(owner);
    await nextEvent(wall, 'board.snapshot');
    const off = nextEvent(
      wall,
      'punch.recorded',
      ({ punch }) => punch.kind === 'job-off' && punch.jobLineId === first,
    );
    await forJo({ kind: 'job-on', jobLineId: second });
    expect((await off).punch.technicianId).toBe(tech.user.id);
    expect((await myDay()).openJobLineIds).toEqual([second]);

    const shop = sut.http().patch('/api/shop').auth(owner, { type: 'bearer' });
    await shop.send({ maxConcurrentJobs: 2 }).expect(200);
    try {
      // Read again under two jobs at a time, the first line stays closed where the switch closed it.
      expect((await myDay()).openJobLineIds).toEqual([second]);
    } finally {
      await sut.http().patch('/api/shop').auth(owner, { type: 'bearer' }).send({ maxConcurrentJobs: 1 });
    }
  });
});
