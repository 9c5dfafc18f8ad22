import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import {
  makeVin,
  type BoardSnapshot,
  type DispatchBoard,
  type KnownVehicle,
  type MyDay,
  type RepairOrderSummary,
  type TimerDto,
} from '@baytime/shared';
import { countRows, DB, type Db } from '../db/database.js';
import { auditLog, repairOrders, timers } from '../db/schema/index.js';
import { FloorService } from '../floor/floor.service.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { RepairOrdersService } from './repair-orders.service.js';

// The widely used worked example of the 49 CFR 565.15 check digit: 1M8GDM9AXKP042788, check digit X;
// model year code K = 2019.
const VALID_VIN = '1M8GDM9AXKP042788';

describe(RepairOrdersService.name, () => {
  let sut: TestApp;
  let advisor: string;
  let foreman: string;
  const order = (vehicle: Record<string, unknown> = {}, extra: Record<string, unknown> = {}) => ({
    customer: { name: 'Wendell Farrow', phone: '(608) 555-0142', email: 'wendell@example.test' },
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
  const read = async (id: number) =>
    (await sut.http().get(`/api/repair-orders/${id}`).auth(advisor, { type: 'bearer' }).expect(200))
      .body as RepairOrderSummary;
  const edit = (id: number, body: object) =>
    sut.http().patch(`/api/repair-orders/${id}`).auth(advisor, { type: 'bearer' }).send(body);
  const onFile = async (vin: string) =>
    (await sut.http().get(`/api/vehicles?vin=${vin}`).auth(advisor, { type: 'bearer' }).expect(200))
      .body as KnownVehicle;
  const auditOf = (id: number) =>
    sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'repair-order'), eq(auditLog.entityId, String(id))))
      .get();

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
    // No promise was given, so it cannot be late; it starts now or later and takes time.
    const { forecast } = lane.lines.find((l) => l.id === ro.lines[0].id)!;
    expect(forecast).toMatchObject({ late: false });
    expect(Date.parse(forecast!.startAt)).toBeGreaterThanOrEqual(Date.parse(after.serverTime) - 1000);
    expect(Date.parse(forecast!.finishAt)).toBeGreaterThan(Date.parse(forecast!.startAt));
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

  it('a new RO for a known VIN leaves earlier ROs as they were written', async () => {
    const vin = makeVin('4HV5MR7BLM900002');
    const { body: first } = await create(
      order(
        { vin, year: 2020, make: 'Halvard', model: 'Morrow', plate: 'OLD 101', odometer: 30_000 },
        { customer: { name: 'Odile Varga', phone: '(608) 555-0101', email: 'odile@example.test' } },
      ),
    ).expect(201);
    // The car changed hands: another name and e-mail, a new plate, the model written out in full.
    const { body: second } = await create(
      order(
        { vin, year: 2020, make: 'Halvard', model: 'Morrow Touring', plate: 'NEW 202', odometer: 41_000 },
        { customer: { name: 'Bram Keto', phone: '(608) 555-0102', email: 'bram@example.test' } },
      ),
    ).expect(201);
    expect(await read(first.id)).toMatchObject({
      customerName: 'Odile Varga',
      customerPhone: '+16085550101',
      customerEmail: 'odile@example.test',
      vehicle: '2020 Halvard Morrow',
      plate: 'OLD 101',
      odometer: 30_000,
    });
    expect(await read(second.id)).toMatchObject({
      customerName: 'Bram Keto',
      customerEmail: 'bram@example.test',
      vehicle: '2020 Halvard Morrow Touring',
      plate: 'NEW 202',
    });
    // A new owner is a new customer; the first owner's record is not edited.
    const db = sut.app.get<Db>(DB);
    const links = db
      .select({ customerId: repairOrders.customerId })
      .from(repairOrders)
      .where(
        eq(
          repairOrders.vehicleId,
          db.select().from(repairOrders).where(eq(repairOrders.id, first.id)).get()!.vehicleId,
        ),
      )
      .all()
      .map((row) => row.customerId);
    expect(new Set(links).size).toBe(2);
    expect(auditOf(second.id)?.detail).toEqual({ previousCustomerId: links[0] });
  });

  it('the same owner back with a new phone keeps one customer; the earlier RO keeps the old phone', async () => {
    const vin = makeVin('4HV5MR7BLM900003');
    const customer = { name: 'Ines Moreau', phone: '(608) 555-0103', email: 'ines@example.test' };
    const { body: first } = await create(order({ vin, year: 2020, odometer: 10_000 }, { customer })).expect(
      201,
    );
    const { body: second } = await create(
      order(
        { vin, year: 2020, odometer: 12_000 },
        { customer: { name: 'ines  moreau', phone: '(608) 555-0104' } },
      ),
    ).expect(201);
    expect((await read(first.id)).customerPhone).toBe('+16085550103');
    // The e-mail was left out this time: the one on file stays.
    expect(await read(second.id)).toMatchObject({
      customerPhone: '+16085550104',
      customerEmail: 'ines@example.test',
    });
    expect(auditOf(second.id)?.detail).toBeNull();
  });

  it('refuses a promised time that has already passed, at the field, and writes nothing', async () => {
    const db = sut.app.get<Db>(DB);
    const before = countRows(db, repairOrders);
    const past = new Date(Date.now() - 60_000).toISOString();
    const { body } = await create(
      order({ vin: makeVin('4HV5MR7BLM900004'), year: 2020, odometer: 5_000 }, { promisedAt: past }),
    ).expect(400);
    expect(body.issues).toEqual([
      { path: ['promisedAt'], message: 'That time has already passed: promise a later one' },
    ]);
    expect(countRows(db, repairOrders)).toBe(before);
    const later = new Date(Date.now() + 3600_000).toISOString();
    await create(
      order({ vin: makeVin('4HV5MR7BLM900004'), year: 2020, odometer: 5_000 }, { promisedAt: later }),
    ).expect(201);
  });

  it('takes a pasted VIN with spaces and dashes', async () => {
    const { body } = await create(order({ vin: ' 1m8 GDM9A-XKP 042788 ', odometer: 70_000 })).expect(201);
    expect(body.vin).toBe(VALID_VIN);
  });

  it('a returning vehicle keeps its plate when intake leaves it out', async () => {
    const vin = makeVin('4HV5MR7BLM900005');
    await create(order({ vin, year: 2020, plate: 'KEEP 303', odometer: 40_000 })).expect(201);
    const { body } = await create(order({ vin, year: 2020, odometer: 42_000 })).expect(201);
    expect((body as RepairOrderSummary).plate).toBe('KEEP 303');
    expect((await onFile(vin)).plate).toBe('KEEP 303');
  });

  it('lowers a reading below the vehicle’s highest only with a reason, and never lowers the vehicle’s', async () => {
    const vin = makeVin('4HV5MR7BLM900006');
    const { body: first } = await create(order({ vin, year: 2020, odometer: 151_200 })).expect(201);
    const { body } = await edit(first.id, { vehicle: { odometer: 100 } }).expect(400);
    expect(body.issues).toEqual([
      {
        path: ['vehicle', 'odometer'],
        message:
          'Lower than the highest reading on record (151,200): check it, or give a reason to save anyway',
      },
    ]);
    expect((await read(first.id)).odometer).toBe(151_200);

    const reason = 'An extra digit was typed at intake';
    await edit(first.id, { vehicle: { odometer: 15_120 }, odometerOverrideReason: reason }).expect(200);
    expect((await read(first.id)).odometer).toBe(15_120);
    expect((await onFile(vin)).lastOdometer).toBe(151_200);
    const edited = sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entityId, String(first.id)), eq(auditLog.action, 'edit')))
      .get();
    expect(edited?.detail).toEqual({
      changes: { odometer: { from: 151_200, to: 15_120 } },
      odometerOverrideReason: reason,
      lastOdometer: 151_200,
    });
    const history = await sut
      .http()
      .get(`/api/repair-orders/${first.id}/history`)
      .auth(advisor, { type: 'bearer' })
      .expect(200);
    expect(history.body.map((entry: { text: string }) => entry.text)).toContain(
      `Details changed: odometer 151,200 → 15,120 (lower reading: ${reason})`,
    );

    // The office sends the reading with every correction; raising it towards the highest rolls nothing back.
    await edit(first.id, { vehicle: { odometer: 15_120 }, concern: 'Shudder at 40 mph' }).expect(200);
    await edit(first.id, { vehicle: { odometer: 15_210 } }).expect(200);
    expect((await onFile(vin)).lastOdometer).toBe(151_200);

    const { body: later } = await create(order({ vin, year: 2020, odometer: 152_000 })).expect(201);
    await edit(later.id, { vehicle: { odometer: 152_400 } }).expect(200);
    expect((await onFile(vin)).lastOdometer).toBe(152_400);
  });

  it('takes a phone, e-mail or plate off when sent empty or null, and keeps what is left out', async () => {
    const vin = makeVin('4HV5MR7BLM900007');
    const { body: written } = await create(
      order({ vin, year: 2020, plate: 'LMN 404', odometer: 20_000 }),
    ).expect(201);
    const { body: cleared } = await edit(written.id, { customer: { phone: '' } }).expect(200);
    expect(cleared).toMatchObject({
      customerPhone: null,
      customerEmail: 'wendell@example.test',
      plate: 'LMN 404',
    });
    expect((await onFile(vin)).customer).toMatchObject({ phone: null, email: 'wendell@example.test' });

    await edit(written.id, { customer: { email: '' }, vehicle: { plate: '' } }).expect(200);
    await edit(written.id, { customer: { phone: '(608) 555-0164' } }).expect(200);
    await edit(written.id, { customer: { phone: null } }).expect(200);
    expect(await read(written.id)).toMatchObject({ customerPhone: null, customerEmail: null, plate: null });
    expect(await onFile(vin)).toMatchObject({ plate: null, customer: { phone: null, email: null } });

    await edit(written.id, { customer: { phone: '(608) 555-0142' } }).expect(200);
    await edit(written.id, { customer: { name: 'Wendell Farrow-Ames' } }).expect(200);
    expect(await read(written.id)).toMatchObject({
      customerName: 'Wendell Farrow-Ames',
      customerPhone: '+16085550142',
    });
    const { body } = await edit(written.id, { customer: { email: 'wendell@' } }).expect(400);
    expect(body.issues).toEqual([{ path: ['customer', 'email'], message: 'Not an e-mail address' }]);
  });

  it('at pick-up, stops the timers left running on its lines and refuses later edits', async () => {
    const tech = await sut.badge('1046');
    const board = async () =>
      (await sut.http().get('/api/board').auth(foreman, { type: 'bearer' }).expect(200))
        .body as BoardSnapshot;
    const bay = (await board()).bays.find((b) => b.state === 'ready')!;
    const ro = await read(bay.repairOrder!.id);
    expect(ro.status).toBe('done');
    // A cure timer left running on a finished line, as an earlier version left them, and the floor
    // read it as it does at start-up.
    const db = sut.app.get<Db>(DB);
    const timer = db
      .insert(timers)
      .values({
        jobLineId: ro.lines[0]!.id,
        bayId: bay.id,
        kind: 'set-time',
        durationSeconds: 3600,
        label: 'Sealant cure',
        startedAt: new Date(Date.now() - 60_000),
        startedBy: tech.user.id,
      })
      .returning()
      .get();
    sut.app.get(FloorService).timersChanged();
    expect((await board()).bays.find((b) => b.id === bay.id)).toMatchObject({ state: 'timer' });

    const kiosk = sut.connect(tech.accessToken);
    await nextEvent(kiosk, 'board.snapshot');
    const heard = nextEvent(kiosk, 'timer.updated', (event) => event.timerId === timer.id);
    const closing = Date.now();
    await sut.http().post(`/api/repair-orders/${ro.id}/close`).auth(advisor, { type: 'bearer' }).expect(200);
    expect(await heard).toMatchObject({ timerId: timer.id, bayId: bay.id });
    const endedAt = db.select().from(timers).where(eq(timers.id, timer.id)).get()!.endedAt;
    expect(endedAt?.getTime()).toBeGreaterThanOrEqual(closing);
    expect(endedAt?.getTime()).toBeLessThanOrEqual(Date.now());
    expect((await board()).bays.find((b) => b.id === bay.id)).toMatchObject({ state: 'free', timer: null });
    const running = (
      await sut.http().get('/api/timers').auth(tech.accessToken, { type: 'bearer' }).expect(200)
    ).body as TimerDto[];
    expect(running.map((t) => t.id)).not.toContain(timer.id);

    const { body } = await edit(ro.id, { vehicle: { odometer: ro.odometer + 100 } }).expect(409);
    expect(body.message).toBe(`RO ${ro.number} is closed: open a new one for more work`);
    expect((await read(ro.id)).odometer).toBe(ro.odometer);
  });

  describe('a VIN outside the 49 CFR 565 rules', () => {
    // The worked example with position 9 changed from X to 4: the check digit fails.
    const WRONG_CHECK = '1M8GDM9A4KP042788';
    // A 1977 vehicle's 13-character serial (invented): before the 17-character VIN.
    const OLD_SERIAL = '7Y37J5G123456';

    it('is refused at the field without a reason', async () => {
      const { body } = await create(
        order({ vin: OLD_SERIAL, year: 1977, make: 'Corvan', model: 'Estate', odometer: 88_000 }),
      ).expect(400);
      expect(body.issues).toEqual([
        { path: ['vehicle', 'vin'], message: 'A VIN has 17 characters' },
        { path: ['vehicle', 'year'], message: 'Model years start at 1981 for 17-character VINs' },
      ]);
    });

    it.each([
      [WRONG_CHECK, 2019, 'Imported: the maker does not use a check digit'],
      [OLD_SERIAL, 1977, 'Built before 1981: serial from the door plate'],
    ])('is saved with a reason, which is audited (%s)', async (vin, year, reason) => {
      const { body } = await create(
        order(
          { vin, year, make: 'Corvan', model: 'Estate', odometer: 90_000 },
          { vinOverrideReason: reason },
        ),
      ).expect(201);
      expect(body).toMatchObject({ vin, vehicle: `${year} Corvan Estate` });
      expect(auditOf(body.id)?.detail).toEqual({ vinOverrideReason: reason });
    });

    it('still has to be letters and digits', async () => {
      const { body } = await create(
        order({ vin: 'AB*12' }, { vinOverrideReason: 'Hand-stamped frame number' }),
      ).expect(400);
      expect(body.issues).toEqual([
        { path: ['vehicle', 'vin'], message: 'A VIN has only letters and digits' },
      ]);
    });
  });
});
