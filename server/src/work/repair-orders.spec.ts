import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeVin, type DispatchBoard, type MyDay } from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { RepairOrdersService } from './repair-orders.service.js';

// 49 CFR 565.15 worked example (CHECKS.md §7): check digit X, model year K = 2019.
const VALID_VIN = '1M8GDM9AXKP042788';

describe(RepairOrdersService.name, () => {
  let sut: TestApp;
  let advisor: string;
  let foreman: string;
  const order = (vehicle: Record<string, unknown> = {}, extra: Record<string, unknown> = {}) => ({
    customer: { name: 'Wendell Farrow', phone: '555-0142', email: 'wendell@example.test' },
    vehicle: { vin: VALID_VIN, year: 2019, make: 'Halvard', model: 'Morrow', odometer: 61_200, ...vehicle },
    concern: 'Shudder when pulling away; due for service',
    lines: [
      { title: 'Automatic transmission fluid and filter service', bookHours: 1.5 },
      { title: 'Road test and inspect mounts', bookHours: 0.5 },
    ],
    ...extra,
  });
  const create = (body: object) =>
    sut.http().post('/api/repair-orders').auth(advisor, { type: 'bearer' }).send(body);

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
    foreman = await sut.signIn(DEMO.foreman);
  });
  afterAll(() => sut.close());

  it('writes an RO with its lines in the queue', async () => {
    const { body } = await create(order()).expect(201);
    expect(body).toMatchObject({
      customerName: 'Wendell Farrow',
      vehicle: '2019 Halvard Morrow',
      vin: VALID_VIN,
      status: 'open',
    });
    expect(body.lines.map((l: { lineNo: number; status: string }) => [l.lineNo, l.status])).toEqual([
      [1, 'queued'],
      [2, 'queued'],
    ]);
    const dispatch = (await sut.http().get('/api/dispatch').auth(foreman, { type: 'bearer' }).expect(200))
      .body as DispatchBoard;
    expect(dispatch.queue.map((l) => l.id)).toEqual(
      expect.arrayContaining(body.lines.map((l: { id: number }) => l.id)),
    );
  });

  it('refuses a wrong check digit at the field, naming the right one', async () => {
    const wrong = `${VALID_VIN.slice(0, 8)}4${VALID_VIN.slice(9)}`;
    const { body } = await create(order({ vin: wrong })).expect(400);
    expect(body.issues).toContainEqual({
      path: ['vehicle', 'vin'],
      message: 'Check digit should be X, not 4',
    });
  });

  it('refuses an odometer lower than the last visit unless a reason is given', async () => {
    const { body } = await create(order({ odometer: 50_000 })).expect(400);
    expect(body.issues[0].path).toEqual(['vehicle', 'odometer']);
    await create(
      order({ odometer: 50_000 }, { odometerOverrideReason: 'Cluster replaced at a dealer' }),
    ).expect(201);
  });

  it('a foreman assigns a new line to a tech in a bay: the kiosk shows it and the bay is staged', async () => {
    const vin = makeVin('7HV5MR7BLM900001');
    const { body: ro } = await create(order({ vin, year: 2020, odometer: 1000 })).expect(201);
    const tech = await sut.badge('1046');
    const kiosk = sut.connect(tech.accessToken);
    await nextEvent(kiosk, 'board.snapshot');
    const dispatch = (await sut.http().get('/api/dispatch').auth(foreman, { type: 'bearer' }))
      .body as DispatchBoard;
    const bay3 = dispatch.bays.find((b) => b.name === 'Bay 8')!;
    const heard = nextEvent(kiosk, 'job-line.updated', ({ jobLine }) => jobLine.id === ro.lines[0].id);
    await sut
      .http()
      .patch(`/api/job-lines/${ro.lines[0].id}`)
      .auth(foreman, { type: 'bearer' })
      .send({ technicianId: tech.user.id, bayId: bay3.id })
      .expect(200);
    await heard;
    const day = (await sut.http().get('/api/me/day').auth(tech.accessToken, { type: 'bearer' }))
      .body as MyDay;
    expect(day.lines.map((l) => l.id)).toContain(ro.lines[0].id);
    const after = (await sut.http().get('/api/dispatch').auth(foreman, { type: 'bearer' }))
      .body as DispatchBoard;
    expect(after.bays.find((b) => b.id === bay3.id)!.state).toBe('staged');
    const lane = after.lanes.find((l) => l.technician.id === tech.user.id)!;
    expect(lane.lines.find((l) => l.id === ro.lines[0].id)!.forecast).not.toBeNull();
  });

  it('lets the owner keep an operations menu', async () => {
    const owner = await sut.signIn(DEMO.owner);
    const { body } = await sut
      .http()
      .post('/api/operations')
      .auth(owner, { type: 'bearer' })
      .send({ title: 'Brake fluid exchange', defaultBookHours: 0.8 })
      .expect(201);
    expect(body).toMatchObject({ skillLevel: 1, active: true });
    const list = await sut.http().get('/api/operations').auth(advisor, { type: 'bearer' }).expect(200);
    expect(list.body).toContainEqual(body);
  });
});
