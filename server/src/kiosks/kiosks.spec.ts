import {
  constants,
  createPublicKey,
  generateKeyPairSync,
  publicEncrypt,
  randomUUID,
  type JsonWebKey,
} from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  identityText,
  type BoardSnapshot,
  type KioskDto,
  type OfflineKeyDto,
  type OfflinePunchDto,
  type OfflinePunchKind,
  type Page,
  type Timecard,
} from '@baytime/shared';
import { DEMO_PIN } from '../demo/demo-shop.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { OfflinePunchesService } from './offline-punches.service.js';

describe(OfflinePunchesService.name, () => {
  let sut: TestApp;
  let owner: string;
  let foreman: string;
  let kiosk: string;
  let key: OfflineKeyDto;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
  });
  const pairKiosk = async (name: string) => {
    const { body } = await as(owner).post('/api/kiosks', { name }).expect(201);
    const paired = await sut.http().post('/api/auth/kiosks/pair').send({ code: body.code }).expect(200);
    return paired.body.accessToken as string;
  };
  /** What the tablet does offline: seals badge, PIN and the punch to the server's public key. */
  const offlinePunch = (
    badge: string,
    pin: string,
    kind: OfflinePunchKind,
    minutesAgo: number,
    seal: (text: string) => string = (text) => sealTo(key, text),
  ) => {
    const id = randomUUID();
    const at = new Date(Date.now() - minutesAgo * 60_000).toISOString();
    return { id, kind, at, keyId: key.keyId, identity: seal(identityText({ badge, pin, id, kind, at })) };
  };
  const upload = (body: object) => as(kiosk).post('/api/kiosks/me/offline-punches', body);
  const offlineList = async () =>
    ((await as(foreman).get('/api/offline-punches').expect(200)).body as Page<OfflinePunchDto>).items;
  const card = async (technicianId: number) =>
    (await as(foreman).get(`/api/timecards?technicianId=${technicianId}`).expect(200)).body as Timecard;
  const techId = async (badge: string) => (await sut.badge(badge)).user.id;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    foreman = await sut.signIn(DEMO.foreman);
    kiosk = await pairKiosk('Kiosk by the door');
    key = (await as(kiosk).get('/api/kiosks/me/offline-key').expect(200)).body;
  });
  afterAll(() => sut.close());

  it('pairs a kiosk once with a code: its token says it is that kiosk, and a wall code will not do', async () => {
    const me = (await as(kiosk).get('/api/me').expect(200)).body;
    expect(me).toMatchObject({ name: 'Kiosk by the door', role: 'kiosk' });
    const wall = await as(owner).post('/api/screens', { name: 'Wall' }).expect(201);
    await sut.http().post('/api/auth/kiosks/pair').send({ code: wall.body.code }).expect(401);
    const again = await as(owner).post('/api/kiosks', { name: 'Spare' }).expect(201);
    await sut.http().post('/api/auth/screens/pair').send({ code: again.body.code }).expect(401);
    // A kiosk is not a wall screen: the wall list does not show it.
    const walls = (await as(owner).get('/api/screens').expect(200)).body as { name: string }[];
    expect(walls.map((w) => w.name)).not.toContain('Kiosk by the door');
  });

  it('a revoked kiosk is refused', async () => {
    const token = await pairKiosk('Old tablet');
    const id = (await as(token).get('/api/me').expect(200)).body.id;
    await sut.http().delete(`/api/kiosks/${id}`).auth(owner, { type: 'bearer' }).expect(200);
    await as(token).get('/api/kiosks/me/offline-key').expect(401);
    await sut.http().delete('/api/kiosks/999999').auth(owner, { type: 'bearer' }).expect(404);
  });

  it('a kiosk says how many punches wait on it: Admin and the wall show it, and not once it is empty', async () => {
    const since = new Date(Date.now() - 5 * 60_000).toISOString();
    await as(kiosk).post('/api/kiosks/me/queue', { waiting: 3, oldestQueuedAt: since }).expect(204);
    const listed = ((await as(owner).get('/api/kiosks').expect(200)).body as KioskDto[]).find(
      (k) => k.name === 'Kiosk by the door',
    )!;
    expect(listed.queue).toMatchObject({ waiting: 3, since });
    const board = (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
    expect(board.kioskQueues).toEqual([{ kioskId: listed.id, name: 'Kiosk by the door', waiting: 3, since }]);
    await as(kiosk).post('/api/kiosks/me/queue', { waiting: -1, oldestQueuedAt: null }).expect(400);
    await as(kiosk).post('/api/kiosks/me/queue', { waiting: 0, oldestQueuedAt: null }).expect(204);
    expect(((await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot).kioskQueues).toEqual([]);
  });

  it('keeps an offline punch unverified and out of the hours until the technician signs in online', async () => {
    const jo = await techId('1045');
    const before = (await card(jo)).punches.length;
    // Jo was on shift already in the demo and clocked off a job 12 minutes ago: a break recorded offline
    // 5 minutes ago, after that, changes no time already counted.
    const punch = offlinePunch('1045', DEMO_PIN, 'break-start', 5);
    const { body } = await upload({ ...punch, breakKind: 'rest' }).expect(202);
    expect(body).toEqual({ id: punch.id });
    await upload({ ...punch, breakKind: 'rest' }).expect(202);
    const stored = (await offlineList()).filter((p) => p.id === punch.id);
    expect(stored).toEqual([
      expect.objectContaining({ status: 'unverified', technicianId: jo, at: punch.at, breakKind: 'rest' }),
    ]);
    expect((await card(jo)).punches).toHaveLength(before);

    await sut.badge('1045');
    const confirmed = (await card(jo)).punches.find((p) => p.id === punch.id);
    expect(confirmed).toMatchObject({ kind: 'break-start', breakKind: 'rest', at: punch.at, recordedBy: jo });
    expect((await offlineList()).find((p) => p.id === punch.id)?.status).toBe('confirmed');
  });

  it('holds an offline punch that would change counted time for the foreman, and says so', async () => {
    const jo = await techId('1045');
    // A shift end recorded offline 20 minutes ago would leave Jo's later clock-off and break uncounted.
    const punch = offlinePunch('1045', DEMO_PIN, 'shift-out', 20);
    await upload(punch).expect(202);
    await sut.badge('1045');
    const offline = (await offlineList()).find((p) => p.id === punch.id)!;
    expect(offline.status).toBe('confirmed');
    expect(offline.problem).toMatch(
      /^Held for review: The late shift end at .+ not counted: accept or reject it$/,
    );
    const { held, punches } = await card(jo);
    expect(held.find((p) => p.id === punch.id)).toMatchObject({ kind: 'shift-out', review: 'pending' });
    expect(punches.map((p) => p.id)).not.toContain(punch.id);
  });

  it('a wrong PIN never punches: refused, answered like any other, and not confirmed at sign-in', async () => {
    const sam = await techId('1046');
    const before = (await card(sam)).punches.length;
    const wrong = offlinePunch('1046', '0000', 'shift-out', 15);
    const right = offlinePunch('1046', DEMO_PIN, 'shift-out', 10);
    expect((await upload(wrong).expect(202)).body).toEqual({ id: wrong.id });
    await upload(right).expect(202);
    const list = await offlineList();
    expect(list.find((p) => p.id === wrong.id)).toMatchObject({ status: 'refused', problem: 'Wrong PIN' });
    expect(list.find((p) => p.id === right.id)).toMatchObject({ status: 'unverified' });

    // A wrong PIN was tried on Sam's badge: the sign-in confirms nothing, the foreman looks first.
    await sut.badge('1046');
    expect((await card(sam)).punches).toHaveLength(before);
    await as(foreman).post(`/api/offline-punches/${wrong.id}/reject`).expect(200);
    await as(foreman).post(`/api/offline-punches/${right.id}/confirm`).expect(200);
    const punches = (await card(sam)).punches;
    expect(punches).toHaveLength(before + 1);
    expect(punches.find((p) => p.id === right.id)).toMatchObject({ kind: 'shift-out', at: right.at });
    expect(punches.some((p) => p.id === wrong.id)).toBe(false);
    const decided = await as(foreman).post(`/api/offline-punches/${wrong.id}/confirm`).expect(409);
    expect(decided.body.message).toBe('That punch is already rejected');
  });

  it('refuses an identity sealed for another punch, an unknown badge and a foreign key', async () => {
    const first = offlinePunch('1044', DEMO_PIN, 'break-end', 5);
    const copied = { ...offlinePunch('1044', DEMO_PIN, 'break-end', 4), identity: first.identity };
    const stranger = offlinePunch('9999', DEMO_PIN, 'shift-in', 3);
    const other = generateForeignKey();
    const foreign = offlinePunch('1044', DEMO_PIN, 'shift-in', 2, (text) => sealTo(other, text));
    for (const body of [copied, stranger, foreign]) await upload(body).expect(202);
    const list = await offlineList();
    expect(list.find((p) => p.id === copied.id)).toMatchObject({
      status: 'refused',
      problem: 'The badge and PIN could not be read',
    });
    expect(list.find((p) => p.id === stranger.id)).toMatchObject({
      status: 'refused',
      problem: 'No technician has that badge',
    });
    expect(list.find((p) => p.id === foreign.id)?.status).toBe('refused');
  });

  it('refuses bad bodies and far-off times, storing nothing', async () => {
    const count = async () =>
      ((await as(foreman).get('/api/offline-punches').expect(200)).body as Page<unknown>).total;
    const before = await count();
    await upload({ ...offlinePunch('1044', DEMO_PIN, 'job-on' as OfflinePunchKind, 1) }).expect(400);
    await upload({ ...offlinePunch('1044', DEMO_PIN, 'shift-in', 1), identity: 'not base64!' }).expect(400);
    await upload({ ...offlinePunch('1044', DEMO_PIN, 'shift-in', -60) }).expect(400);
    await upload({ ...offlinePunch('1044', DEMO_PIN, 'shift-in', 8 * 24 * 60) }).expect(400);
    expect(await count()).toBe(before);
  });
});

function sealTo(key: OfflineKeyDto, text: string): string {
  return publicEncrypt(
    {
      key: createPublicKey({ key: key.publicKey as JsonWebKey, format: 'jwk' }),
      padding: constants.RSA_PKCS1_OAEP_PADDING,
      oaepHash: 'sha256',
    },
    Buffer.from(text),
  ).toString('base64');
}

function generateForeignKey(): OfflineKeyDto {
  const { publicKey } = generateKeyPairSync('rsa', { modulusLength: 2048 });
  return {
    keyId: '0000000000000000',
    publicKey: publicKey.export({ format: 'jwk' }) as Record<string, unknown>,
  };
}
