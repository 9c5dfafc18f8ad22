import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { randomUUID } from 'node:crypto';
import { and, eq } from 'drizzle-orm';
import type { JobLineDto, RepairOrderSummary, SignInAnswer } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { RepairOrdersService } from './repair-orders.service.js';

const HOUR = 3600_000;

describe(`${RepairOrdersService.name} refusing an edit made on stale data`, () => {
  let sut: TestApp;
  let advisor: string;
  let otherAdvisor: string;
  let foreman: string;
  let tech: SignInAnswer;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  const edits = (entity: string, entityId: number) =>
    sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(
        and(
          eq(auditLog.entity, entity),
          eq(auditLog.entityId, String(entityId)),
          eq(auditLog.action, 'edit'),
        ),
      )
      .all();
  const ro = async (id: number) =>
    (await as(advisor).get(`/api/repair-orders/${id}`).expect(200)).body as RepairOrderSummary;
  const write = async () =>
    (
      await as(advisor)
        .post('/api/repair-orders', {
          customer: { name: 'Ysolde Marrick', phone: '(608) 555-0171' },
          vehicle: {
            vin: '1M8GDM9AXKP042788',
            year: 1989,
            make: 'Tarrow',
            model: 'Kestrel',
            odometer: 61_000,
          },
          concern: 'Rattle over bumps',
          promisedAt: new Date(Date.now() + 48 * HOUR).toISOString(),
          lines: [
            { title: 'Inspect front suspension', bookHours: 0.8 },
            { title: 'Replace sway bar links', bookHours: 1.1 },
          ],
        })
        .expect(201)
    ).body as RepairOrderSummary;

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
    otherAdvisor = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
    tech = await sut.badge('1045');
  });
  afterAll(() => sut.close());

  it('refuses an RO edit of a field someone changed since it was read, storing nothing of it', async () => {
    const written = await write();
    await as(advisor)
      .patch(`/api/repair-orders/${written.id}`, {
        concern: 'Rattle and a clunk',
        was: { concern: 'Rattle over bumps' },
      })
      .expect(200);
    const refused = await as(otherAdvisor)
      .patch(`/api/repair-orders/${written.id}`, {
        concern: 'Only a rattle',
        vehicle: { plate: 'RM 4410' },
        was: { concern: 'Rattle over bumps', vehicle: { plate: null } },
      })
      .expect(409);
    expect(refused.body.message).toBe(
      `Someone else changed the concern of RO ${written.number} since you opened it: reload to see their change`,
    );
    expect(await ro(written.id)).toMatchObject({ concern: 'Rattle and a clunk', plate: null });
    expect(edits('repair-order', written.id)).toHaveLength(1);

    // Another field read at the same time is no conflict; without `was`, as it always was.
    await as(otherAdvisor)
      .patch(`/api/repair-orders/${written.id}`, {
        vehicle: { plate: 'RM 4410' },
        was: { vehicle: { plate: null } },
      })
      .expect(200);
    const unchecked = (
      await as(otherAdvisor)
        .patch(`/api/repair-orders/${written.id}`, { concern: 'Only a rattle' })
        .expect(200)
    ).body as RepairOrderSummary;
    expect(unchecked).toMatchObject({ concern: 'Only a rattle', plate: 'RM 4410' });
  });

  it('compares a phone, an e-mail and a promise as stored, whatever their spelling', async () => {
    const written = await write();
    const promise = new Date(Date.now() + 72 * HOUR).toISOString();
    await as(advisor)
      .patch(`/api/repair-orders/${written.id}`, {
        customer: { phone: '608-555-0199', email: 'Ysolde@Example.test' },
        promisedAt: promise,
        was: { customer: { phone: '(608) 555-0171', email: null }, promisedAt: written.promisedAt },
      })
      .expect(200);
    // Read back as the office shows them: another spelling of the same phone, e-mail and instant.
    await as(otherAdvisor)
      .patch(`/api/repair-orders/${written.id}`, {
        concern: 'Rattle over bumps, front left',
        was: {
          customer: { phone: '(608) 555-0199', email: 'ysolde@example.test' },
          promisedAt: promise.replace('Z', '+00:00'),
          concern: 'Rattle over bumps',
        },
      })
      .expect(200);
  });

  it('refuses a line edit of a field someone changed since it was read, storing nothing of it', async () => {
    const written = await write();
    const line = written.lines[0]!;
    await as(advisor)
      .patch(`/api/job-lines/${line.id}/details`, { bookHours: 1.2, was: { bookHours: 0.8 } })
      .expect(200);
    const refused = await as(otherAdvisor)
      .patch(`/api/job-lines/${line.id}/details`, {
        bookHours: 0.5,
        title: 'Look at the front end',
        was: { bookHours: 0.8, title: 'Inspect front suspension' },
      })
      .expect(409);
    expect(refused.body.message).toBe(
      'Someone else changed the book hours of line 1 since you opened it: reload to see their change',
    );
    expect((await ro(written.id)).lines[0]).toMatchObject({
      bookHours: 1.2,
      title: 'Inspect front suspension',
    });
    expect(edits('job-line', line.id)).toHaveLength(1);

    // Another field read at the same time is no conflict; without `was`, as it always was.
    await as(otherAdvisor)
      .patch(`/api/job-lines/${line.id}/details`, {
        title: 'Look at the front end',
        was: { title: 'Inspect front suspension' },
      })
      .expect(200);
    const unchecked = (
      await as(otherAdvisor).patch(`/api/job-lines/${line.id}/details`, { bookHours: 0.5 }).expect(200)
    ).body as JobLineDto;
    expect(unchecked).toMatchObject({ bookHours: 0.5, title: 'Look at the front end' });
  });

  it('takes a line edit read before the foreman assigned the line and its technician clocked on', async () => {
    const written = await write();
    const line = written.lines[1]!;
    await as(foreman).patch(`/api/job-lines/${line.id}`, { technicianId: tech.user.id }).expect(200);
    // On shift in the demo shop already.
    await as(tech.accessToken)
      .post('/api/punches', { id: randomUUID(), kind: 'job-on', jobLineId: line.id })
      .expect(201);
    const saved = (
      await as(advisor)
        .patch(`/api/job-lines/${line.id}/details`, {
          title: 'Replace both sway bar links',
          was: { title: 'Replace sway bar links' },
        })
        .expect(200)
    ).body as JobLineDto;
    expect(saved).toMatchObject({ title: 'Replace both sway bar links', status: 'working' });
  });
});
