import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  makeVin,
  type CreatedIntegrationKey,
  type IntegrationKeyDto,
  type IntegrationScope,
  type LiveRefusal,
  type RepairOrderSummary,
} from '@baytime/shared';
import { countRows, DB, type Db } from '../db/database.js';
import { auditLog, integrationKeys, repairOrders } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { IntegrationKeysService, KEY_CALLS_PER_MINUTE } from './integration-keys.service.js';

describe(IntegrationKeysService.name, () => {
  let sut: TestApp;
  let db: Db;
  let owner: string;

  const makeKey = async (name: string, scopes: IntegrationScope[]) =>
    (
      await sut
        .http()
        .post('/api/integration-keys')
        .auth(owner, { type: 'bearer' })
        .send({ name, scopes })
        .expect(201)
    ).body as CreatedIntegrationKey;
  const order = (externalRef: string, vinTail: string) => ({
    externalRef,
    customer: { name: 'Orla Penhallow', phone: '608-555-0177' },
    vehicle: {
      vin: makeVin(`3VWKM7AJ${vinTail}`),
      year: 2021,
      make: 'Corvane',
      model: 'Ridgeback',
      odometer: 40_100,
    },
    concern: 'Brake pedal feels soft',
    lines: [
      { title: 'Brake fluid exchange', bookHours: 0.8 },
      { title: 'Inspect front calipers', bookHours: 0.5 },
    ],
  });
  const withKey = (secret: string) => ({
    get: (path: string) => sut.http().get(path).auth(secret, { type: 'bearer' }),
    post: (path: string, body: object) => sut.http().post(path).auth(secret, { type: 'bearer' }).send(body),
  });

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    owner = await sut.signIn(DEMO.owner);
  });
  afterAll(() => sut.close());

  it('shows a new key once and keeps only its hash', async () => {
    const { key, secret } = await makeKey('Front counter system', ['repair-orders:write']);
    expect(secret).toMatch(/^btk_[A-Za-z0-9_-]{43}$/);
    expect(key).toMatchObject({
      name: 'Front counter system',
      scopes: ['repair-orders:write'],
      lastUsedAt: null,
    });
    expect(secret.startsWith(key.hint)).toBe(true);
    const stored = db.select().from(integrationKeys).where(eq(integrationKeys.id, key.id)).get()!;
    expect(JSON.stringify(stored)).not.toContain(secret);
    const listed = await sut.http().get('/api/integration-keys').auth(owner, { type: 'bearer' }).expect(200);
    expect(JSON.stringify(listed.body)).not.toContain(secret);
    await sut
      .http()
      .post('/api/integration-keys')
      .auth(owner, { type: 'bearer' })
      .send({ name: 'Front counter system', scopes: ['reports:read'] })
      .expect(409);
  });

  it('writes an RO with its lines, audited under the key, and a retry with the same externalRef writes nothing', async () => {
    const { key, secret } = await makeKey('Dealer management sync', ['repair-orders:write']);
    const calledFrom = Date.now();
    const first = await withKey(secret)
      .post('/api/repair-orders', order('DMS-88121', 'M4512345'))
      .expect(201);
    const ro = first.body as RepairOrderSummary;
    expect(ro).toMatchObject({ externalRef: 'DMS-88121', advisorId: null, customerName: 'Orla Penhallow' });
    expect(ro.lines.map((line) => line.title)).toEqual(['Brake fluid exchange', 'Inspect front calipers']);

    const before = countRows(db, repairOrders);
    const again = await withKey(secret)
      .post('/api/repair-orders', order('DMS-88121', 'M4512345'))
      .expect(200);
    const calledUntil = Date.now();
    expect((again.body as RepairOrderSummary).id).toBe(ro.id);
    expect(countRows(db, repairOrders)).toBe(before);

    const created = db
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'repair-order'), eq(auditLog.entityId, String(ro.id))))
      .get()!;
    expect(created).toMatchObject({ action: 'create', actorId: null, integrationKeyId: key.id });
    expect(created.detail).toMatchObject({ integrationKey: 'Dealer management sync' });
    const calls = db
      .select()
      .from(auditLog)
      .where(
        and(
          eq(auditLog.entity, 'integration-key'),
          eq(auditLog.action, 'call'),
          eq(auditLog.entityId, String(key.id)),
        ),
      )
      .all();
    expect(calls.map((call) => call.detail)).toEqual([
      { integrationKey: 'Dealer management sync', method: 'POST', path: '/api/repair-orders' },
      { integrationKey: 'Dealer management sync', method: 'POST', path: '/api/repair-orders' },
    ]);
    const listed = (await sut.http().get('/api/integration-keys').auth(owner, { type: 'bearer' }))
      .body as IntegrationKeyDto[];
    // The last use is the time of the second call.
    const lastUsedAt = Date.parse(listed.find((k) => k.id === key.id)!.lastUsedAt!);
    expect(lastUsedAt).toBeGreaterThanOrEqual(calledFrom);
    expect(lastUsedAt).toBeLessThanOrEqual(calledUntil);
  });

  it('answers a bad body with 400 and saves nothing', async () => {
    const { secret } = await makeKey('Sloppy feed', ['repair-orders:write']);
    const before = countRows(db, repairOrders);
    const bad = { ...order('SLOPPY-1', 'M4512346'), lines: [{ title: 'Brakes', bookHours: -1 }] };
    const response = await withKey(secret).post('/api/repair-orders', bad).expect(400);
    expect(response.body.issues).toEqual([
      { path: ['lines', 0, 'bookHours'], message: 'Book hours is at least 0.1' },
    ]);
    expect(countRows(db, repairOrders)).toBe(before);
  });

  it('lets a key call only the routes of its scopes, never the apps', async () => {
    const { secret } = await makeKey('Reporting warehouse', ['reports:read']);
    await withKey(secret).get('/api/reports/labour').expect(200);
    const refused = await withKey(secret).post('/api/repair-orders', order('WH-1', 'M4512347')).expect(403);
    expect(refused.body.message).toBe('This key lacks the repair-orders:write scope');
    for (const path of ['/api/me', '/api/board', '/api/users', '/api/integration-keys']) {
      const response = await withKey(secret).get(path).expect(403);
      expect(response.body.message, path).toBe('An integration key cannot do that');
    }
    const socket = sut.connect(secret);
    const refusal = await new Promise<LiveRefusal>((resolve, reject) => {
      socket.on('connect', () => reject(new Error('A key opened a live socket')));
      socket.on('connect_error', (error) => resolve((error as Error & { data: LiveRefusal }).data));
    });
    expect(refusal.reason).toBe('token-invalid');
  });

  it('refuses a revoked key', async () => {
    const { key, secret } = await makeKey('Retired sync', ['repair-orders:read']);
    await withKey(secret).get('/api/repair-orders').expect(200);
    await sut.http().delete(`/api/integration-keys/${key.id}`).auth(owner, { type: 'bearer' }).expect(200);
    const response = await withKey(secret).get('/api/repair-orders').expect(401);
    expect(response.body.message).toBe('That integration key is unknown or revoked');
    await withKey('btk_not-a-key-at-all').get('/api/repair-orders').expect(401);
  });

  it('replaces a key under the same name once the old one is revoked, and names who made a key revoked', async () => {
    const revoke = async (id: number) =>
      (await sut.http().delete(`/api/integration-keys/${id}`).auth(owner, { type: 'bearer' }).expect(200))
        .body as IntegrationKeyDto;
    const { key: old } = await makeKey('Parts ordering', ['repair-orders:read']);
    const refused = await sut
      .http()
      .post('/api/integration-keys')
      .auth(owner, { type: 'bearer' })
      .send({ name: 'Parts ordering', scopes: ['repair-orders:read'] })
      .expect(409);
    expect(refused.body.message).toBe('A key in use already has that name');

    const listed = (await sut.http().get('/api/integration-keys').auth(owner, { type: 'bearer' }))
      .body as IntegrationKeyDto[];
    const createdByName = listed.find((k) => k.id === old.id)!.createdByName;
    expect(createdByName).toBe('Rosa Pellman');
    expect(await revoke(old.id)).toMatchObject({ id: old.id, createdByName });
    expect(await revoke(old.id)).toMatchObject({ id: old.id, createdByName });

    const { key: replacement, secret } = await makeKey('Parts ordering', ['repair-orders:read']);
    expect(replacement.id).not.toBe(old.id);
    await withKey(secret).get('/api/repair-orders?limit=1').expect(200);
    await revoke(replacement.id);
    await makeKey('Parts ordering', ['repair-orders:read']);
  });

  it(`throttles a key past ${KEY_CALLS_PER_MINUTE} calls a minute`, async () => {
    const { secret } = await makeKey('Runaway loop', ['repair-orders:read']);
    for (let i = 0; i < KEY_CALLS_PER_MINUTE; i++)
      await withKey(secret).get('/api/repair-orders?limit=1').expect(200);
    const response = await withKey(secret).get('/api/repair-orders?limit=1').expect(429);
    expect(response.body.message).toMatch(/^This key made more than 120 calls in a minute/);
  });
});
