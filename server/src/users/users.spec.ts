import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import type { UserDto } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog } from '../db/schema/index.js';
import { DEMO_PIN } from '../demo/demo-shop.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { UsersService } from './users.service.js';

describe(UsersService.name, () => {
  let sut: TestApp;
  let owner: string;
  let foreman: string;
  const patch = (token: string, id: number, body: object) =>
    sut.http().patch(`/api/users/${id}`).auth(token, { type: 'bearer' }).send(body);
  const audits = (id: number) =>
    sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'user'), eq(auditLog.entityId, String(id))))
      .all();
  const add = async (body: object) =>
    (await sut.http().post('/api/users').auth(owner, { type: 'bearer' }).send(body).expect(201))
      .body as UserDto;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
  });
  afterAll(() => sut.close());

  it("lists each user with their own rates: today's, and every one on record, newest first", async () => {
    const rates = { payType: 'flat-rate', pin: '2468', role: 'technician' };
    const orla = await add({ ...rates, name: 'Orla Finch', badge: '2601', flatRateCents: 30_00 });
    const pim = await add({ ...rates, name: 'Pim Garrow', badge: '2602', flatRateCents: 26_00 });
    await patch(owner, orla.id, { flatRateCents: 34_00, effectiveFrom: '2099-01-05' }).expect(200);

    const listed = (await sut.http().get('/api/users').auth(owner, { type: 'bearer' }).expect(200))
      .body as UserDto[];
    const [orlaListed, pimListed] = [orla.id, pim.id].map((id) => listed.find((user) => user.id === id)!);
    expect(orlaListed).toMatchObject({ flatRateCents: 30_00 });
    expect(orlaListed!.payRates.map((rate) => [rate.effectiveFrom, rate.flatRateCents])).toEqual([
      ['2099-01-05', 34_00],
      [orla.payRates[0]!.effectiveFrom, 30_00],
    ]);
    expect(pimListed).toMatchObject({ flatRateCents: 26_00 });
    expect(pimListed!.payRates.map((rate) => rate.flatRateCents)).toEqual([26_00]);
  });

  it('edits name, badge, skill level and the overtime rule, audited with what each was', async () => {
    const tech = await add({ name: 'Wren Hollis', role: 'technician', badge: '2201', pin: '2468' });
    const { body } = await patch(owner, tech.id, {
      name: 'Wren Hollis-Marsh',
      badge: '2202',
      skillLevel: 3,
      overtimeExempt: false,
    }).expect(200);
    expect(body).toMatchObject({
      name: 'Wren Hollis-Marsh',
      badge: '2202',
      skillLevel: 3,
      overtimeExempt: false,
    });
    expect(audits(tech.id).at(-1)!.detail).toEqual({
      fields: ['name', 'badge', 'skillLevel', 'overtimeExempt'],
      changes: {
        name: { from: 'Wren Hollis', to: 'Wren Hollis-Marsh' },
        badge: { from: '2201', to: '2202' },
        skillLevel: { from: 1, to: 3 },
      },
    });
    await patch(foreman, tech.id, { name: 'Nope' }).expect(403);
  });

  it('resets a PIN: the old one stops working, the new one signs in, and the audit never holds it', async () => {
    const tech = await add({ name: 'Ives Parr', role: 'technician', badge: '2301', pin: DEMO_PIN });
    await patch(owner, tech.id, { pin: '97531' }).expect(200);
    await sut.http().post('/api/auth/badge').send({ badge: '2301', pin: DEMO_PIN }).expect(401);
    await sut.http().post('/api/auth/badge').send({ badge: '2301', pin: '97531' }).expect(200);
    expect(JSON.stringify(audits(tech.id).at(-1)!.detail)).not.toContain('97531');
    expect(audits(tech.id).at(-1)!.detail).toEqual({ fields: ['pin (changed)'], changes: {} });
  });

  it('changes a role: the old sign-in stops, and the new role needs its own way to sign in', async () => {
    const tech = await add({ name: 'Dell Amory', role: 'technician', badge: '2401', pin: '1357' });
    const session = (
      await sut.http().post('/api/auth/badge').send({ badge: '2401', pin: '1357' }).expect(200)
    ).body.accessToken as string;
    const refused = await patch(owner, tech.id, { role: 'advisor' }).expect(400);
    expect(refused.body.issues).toEqual([{ path: ['email'], message: 'Office staff need an e-mail' }]);
    await patch(owner, tech.id, {
      role: 'advisor',
      email: 'dell@marlowcreek.test',
      password: 'a-long-password',
    }).expect(200);
    await sut.http().get('/api/me').auth(session, { type: 'bearer' }).expect(401);
    await sut
      .http()
      .post('/api/auth/login')
      .send({ email: 'dell@marlowcreek.test', password: 'a-long-password' })
      .expect(200);
    const me = (await sut.http().get('/api/me').auth(owner, { type: 'bearer' }).expect(200)).body as UserDto;
    await patch(owner, me.id, { role: 'foreman' }).expect(409);
  });

  it('refuses to take a technician on shift off the floor, and says to clock them out first', async () => {
    const tech = await add({ name: 'Tamsin Ekwe', role: 'technician', badge: '2701', pin: '8642' });
    const punch = (body: object) =>
      sut.punch(foreman, { technicianId: tech.id, ...body }).expect((response) => {
        expect(response.status, JSON.stringify(response.body)).toBe(201);
      });
    const refusal = 'Tamsin Ekwe is on shift: clock them out at the kiosk or on their timecard first';
    await punch({ kind: 'shift-in' });
    expect((await patch(owner, tech.id, { active: false }).expect(409)).body.message).toBe(refusal);
    await punch({ kind: 'break-start', breakKind: 'rest' });
    expect((await patch(owner, tech.id, { active: false }).expect(409)).body.message).toBe(refusal);
    const becomingAdvisor = {
      role: 'advisor',
      email: 'tamsin@marlowcreek.test',
      password: 'a-long-password',
    };
    expect((await patch(owner, tech.id, becomingAdvisor).expect(409)).body.message).toBe(refusal);
    await sut.http().post('/api/auth/badge').send({ badge: '2701', pin: '8642' }).expect(200);
    expect(audits(tech.id)).toHaveLength(1);

    await punch({ kind: 'break-end' });
    await punch({ kind: 'shift-out' });
    await patch(owner, tech.id, { active: false }).expect(200);
  });

  it('deactivates and reactivates a person', async () => {
    const tech = await add({ name: 'Bo Quill', role: 'technician', badge: '2501', pin: '8642' });
    await patch(owner, tech.id, { active: false }).expect(200);
    await sut.http().post('/api/auth/badge').send({ badge: '2501', pin: '8642' }).expect(401);
    await patch(owner, tech.id, { active: true }).expect(200);
    await sut.http().post('/api/auth/badge').send({ badge: '2501', pin: '8642' }).expect(200);
    expect(audits(tech.id).map((a) => a.detail?.changes)).toEqual([
      undefined,
      { active: { from: true, to: false } },
      { active: { from: false, to: true } },
    ]);
  });
});
