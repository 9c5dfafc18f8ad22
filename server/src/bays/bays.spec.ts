import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import type { BayDto, BoardSnapshot, MyDay, RepairOrderHistoryEntry, SignInAnswer } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog, users } from '../db/schema/index.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { BaysService } from './bays.service.js';

describe(BaysService.name, () => {
  let sut: TestApp;
  let owner: string;
  let foreman: string;
  let jo: SignInAnswer;
  let sam: SignInAnswer;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
    put: (path: string, body: object) => sut.http().put(path).auth(token, { type: 'bearer' }).send(body),
  });
  const board = async () => (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
    jo = await sut.badge('1045');
    sam = await sut.badge('1046');
  });
  afterAll(() => sut.close());

  it('a bay in check goes to ready when the technician records the final check on the kiosk (bug 2)', async () => {
    const inCheck = (await board()).bays.find((b) => b.state === 'check')!;
    const day = (await as(jo.accessToken).get('/api/me/day').expect(200)).body as MyDay;
    expect(day.finalChecks).toEqual([
      {
        bayId: inCheck.id,
        bayName: inCheck.name,
        repairOrderNumber: inCheck.repairOrder!.number,
        vehicle: inCheck.vehicle,
      },
    ]);
    // Sam never worked on that vehicle.
    await as(sam.accessToken).post(`/api/bays/${inCheck.id}/final-check`).expect(403);
    const wall = sut.connect(owner);
    await nextEvent(wall, 'board.snapshot');
    const heard = nextEvent(wall, 'bay.updated', ({ bay }) => bay.id === inCheck.id);
    await as(jo.accessToken)
      .post(`/api/bays/${inCheck.id}/final-check`, { note: 'Road test: tracks straight' })
      .expect(200);
    expect((await heard).bay.state).toBe('ready');
    const rows = sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'repair-order'), eq(auditLog.action, 'final-check')))
      .all();
    expect(rows.map((row) => [row.entityId, row.actorId, row.detail])).toEqual([
      [
        String(inCheck.repairOrder!.id),
        jo.user.id,
        { bayId: inCheck.id, bayName: inCheck.name, note: 'Road test: tracks straight' },
      ],
    ]);
    await as(jo.accessToken).post(`/api/bays/${inCheck.id}/final-check`).expect(409);
    expect(((await as(jo.accessToken).get('/api/me/day').expect(200)).body as MyDay).finalChecks).toEqual([]);
  });

  it('tells the release of a bay in the history of the RO whose vehicle held it, with who and when', async () => {
    const held = (await board()).bays.find((b) => b.repairOrder !== null && b.state !== 'working')!;
    const roId = held.repairOrder!.id;
    const wall = sut.connect(owner);
    await nextEvent(wall, 'board.snapshot');
    const told = nextEvent(wall, 'repair-order.updated', ({ repairOrderId }) => repairOrderId === roId);
    const before = Date.now();
    await as(foreman).post(`/api/bays/${held.id}/release`).expect(200);
    await told;
    const history = (await as(foreman).get(`/api/repair-orders/${roId}/history`).expect(200))
      .body as RepairOrderHistoryEntry[];
    const foremanName = sut.app
      .get<Db>(DB)
      .select({ name: users.name })
      .from(users)
      .where(eq(users.email, DEMO.foreman))
      .get()!.name;
    const released = history.filter((entry) => entry.action === 'repair-order.bay-released');
    expect(released.map(({ actorName, text }) => ({ actorName, text }))).toEqual([
      { actorName: foremanName, text: `Released ${held.name}` },
    ]);
    expect(Date.parse(released[0]!.at)).toBeGreaterThanOrEqual(before);

    // A bay already free held no vehicle: no RO hears of it.
    await as(foreman).post(`/api/bays/${held.id}/release`).expect(200);
    const again = (await as(foreman).get(`/api/repair-orders/${roId}/history`).expect(200))
      .body as RepairOrderHistoryEntry[];
    expect(again.filter((entry) => entry.action === 'repair-order.bay-released')).toHaveLength(1);
  });

  it('reorders the bays and retires one: open wall screens hear the new order at once', async () => {
    const bays = (await as(owner).get('/api/bays').expect(200)).body as BayDto[];
    const free = (await board()).bays.filter((b) => b.state === 'free').map((b) => b.id);
    const wall = sut.connect(owner);
    await nextEvent(wall, 'board.snapshot');
    const reversed = bays.map((b) => b.id).reverse();
    const ordered = nextEvent(wall, 'floor.updated', ({ bayIds }) => bayIds[0] === reversed[0]);
    await as(owner).put('/api/bays/order', { bayIds: reversed }).expect(200);
    expect((await ordered).bayIds).toEqual(reversed);
    await as(owner)
      .put('/api/bays/order', { bayIds: reversed.slice(1) })
      .expect(400);
    await as(foreman).put('/api/bays/order', { bayIds: reversed }).expect(403);

    const retired = free[0]!;
    const gone = nextEvent(wall, 'floor.updated', ({ bayIds }) => !bayIds.includes(retired));
    await as(owner).patch(`/api/bays/${retired}`, { active: false }).expect(200);
    expect((await gone).bayIds).toEqual(reversed.filter((id) => id !== retired));

    const added = nextEvent(wall, 'bay.updated', ({ bay }) => bay.name === 'Bay 9');
    const placed = nextEvent(wall, 'floor.updated', ({ bayIds }) => bayIds.length === reversed.length);
    const bay9 = (await as(owner).post('/api/bays', { name: 'Bay 9' }).expect(201)).body as BayDto;
    expect((await added).bay).toMatchObject({ id: bay9.id, state: 'free' });
    expect((await placed).bayIds.at(-1)).toBe(bay9.id);
  });

  it('refuses a name another bay has in other capitals, and lets a bay change the capitals of its own', async () => {
    const bays = (await as(owner).get('/api/bays').expect(200)).body as BayDto[];
    const bay1 = bays.find((b) => b.name === 'Bay 1')!;
    const bay2 = bays.find((b) => b.name === 'Bay 2')!;
    const refused = await as(owner).post('/api/bays', { name: ' bay 1 ' }).expect(409);
    expect(refused.body.message).toBe('There is already a bay called Bay 1');
    await as(owner).patch(`/api/bays/${bay2.id}`, { name: 'BAY 1' }).expect(409);
    await as(owner).patch(`/api/bays/${bay1.id}`, { name: 'BAY 1' }).expect(200);
    const after = (await as(owner).get('/api/bays').expect(200)).body as BayDto[];
    expect(after.map((b) => b.name).sort()).toEqual(
      bays.map((b) => (b.id === bay1.id ? 'BAY 1' : b.name)).sort(),
    );
  });

  it('refuses to retire a bay with work in it', async () => {
    const busy = (await board()).bays.find((b) => b.state === 'working')!;
    const refused = await as(owner).patch(`/api/bays/${busy.id}`, { active: false }).expect(409);
    expect(refused.body.message).toBe(`${busy.name} has work in it: move the work or release the bay first`);
  });
});
