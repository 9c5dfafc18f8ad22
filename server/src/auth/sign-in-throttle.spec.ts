import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { eq } from 'drizzle-orm';
import { DB, type Db } from '../db/database.js';
import { signInThrottles } from '../db/schema/index.js';
import { DEMO_PASSWORD } from '../demo/demo-shop.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { clientAddressKey } from './client-address.js';
import { SignInThrottle, waitWords } from './sign-in-throttle.js';

const verifications = vi.hoisted(() => ({ count: 0 }));
vi.mock('./passwords.js', async (importOriginal) => {
  const original = await importOriginal<typeof import('./passwords.js')>();
  return {
    ...original,
    verifySecret: (secret: string, stored: string | null) => {
      verifications.count += 1;
      return original.verifySecret(secret, stored);
    },
  };
});

const MINUTE = 60_000;

describe(SignInThrottle.name, () => {
  let dataDir: string;
  let sut: TestApp;
  const start = async () => (sut = await startTestApp({ BAYTIME_DATA_DIR: dataDir }));
  const wrongPin = (badge = '1046') => sut.http().post('/api/auth/badge').send({ badge, pin: '0000' });
  const rightPin = (badge = '1046') => sut.http().post('/api/auth/badge').send({ badge, pin: '4321' });
  const row = (key: string) =>
    sut.app.get<Db>(DB).select().from(signInThrottles).where(eq(signInThrottles.key, key)).get();

  beforeEach(async () => {
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    dataDir = mkdtempSync(join(tmpdir(), 'baytime-throttle-'));
    await start();
    verifications.count = 0;
  });
  afterEach(async () => {
    await sut.close();
    rmSync(dataDir, { recursive: true, force: true });
    vi.useRealTimers();
  });

  it('checks at most 5 of 40 concurrent wrong PINs and answers 429 to the rest', async () => {
    const answers = await Promise.all(Array.from({ length: 40 }, () => wrongPin()));
    const statuses = answers.map((answer) => answer.status);
    expect(verifications.count).toBe(5);
    expect(statuses.filter((status) => status === 401)).toHaveLength(5);
    expect(statuses.filter((status) => status === 429)).toHaveLength(35);
  });

  it('lets 6 right passwords at once all in', async () => {
    const answers = await Promise.all(
      Array.from({ length: 6 }, () =>
        sut.http().post('/api/auth/login').send({ email: DEMO.foreman, password: DEMO_PASSWORD }),
      ),
    );
    expect(answers.map((answer) => answer.status)).toEqual(Array(6).fill(200));
  });

  it('says how long to wait in words and in Retry-After', async () => {
    for (let i = 0; i < 5; i++) await wrongPin().expect(401);
    const locked = await wrongPin().expect(429);
    expect(locked.body.message).toBe('Too many wrong tries. Try again in 1 minute.');
    expect(Number(locked.headers['retry-after'])).toBeGreaterThan(55);
    expect(Number(locked.headers['retry-after'])).toBeLessThanOrEqual(60);
    // The real technician with the right PIN waits too: the lock is on the badge.
    await rightPin().expect(429);
  });

  it('keeps a lock across a restart on the same database', async () => {
    for (let i = 0; i < 5; i++) await wrongPin().expect(401);
    await sut.close();
    await start();
    const locked = await rightPin().expect(429);
    expect(locked.body.message).toMatch(/Try again in 1 minute/);
  });

  it('locks for longer each time, and a right PIN after the lock starts afresh', async () => {
    for (let i = 0; i < 5; i++) await wrongPin().expect(401);
    expect((await wrongPin().expect(429)).headers['retry-after']).toBe('60');
    vi.setSystemTime(Date.now() + MINUTE + 1000);

    for (let i = 0; i < 5; i++) await wrongPin().expect(401);
    const second = await wrongPin().expect(429);
    expect(second.body.message).toBe('Too many wrong tries. Try again in 2 minutes.');
    vi.setSystemTime(Date.now() + 2 * MINUTE + 1000);

    for (let i = 0; i < 5; i++) await wrongPin().expect(401);
    expect((await wrongPin().expect(429)).body.message).toMatch(/in 4 minutes/);
    vi.setSystemTime(Date.now() + 4 * MINUTE + 1000);

    await rightPin().expect(200);
    expect(row('badge:1046')).toBeUndefined();
    for (let i = 0; i < 5; i++) await wrongPin().expect(401);
    expect((await wrongPin().expect(429)).headers['retry-after']).toBe('60');
  });

  it('throttles one address across badges: 20 wrong tries lock it for everyone', async () => {
    const badges = ['1041', '1042', '1043', '1044'];
    for (const badge of badges) for (let i = 0; i < 4; i++) await wrongPin(badge).expect(401);
    await rightPin('1045').expect(200);
    for (let i = 0; i < 4; i++) await wrongPin('1045').expect(401);
    // 20 wrong tries from this address (the right one does not count): it is locked for everyone.
    expect(row('ip:127.0.0.1')).toMatchObject({ failures: 0, lockStep: 1 });
    const locked = await rightPin('1046').expect(429);
    expect(locked.body.message).toBe('Too many wrong tries. Try again in 1 minute.');
  });

  it('forgets an address’s wrong tries a quarter of an hour after the first: slips through a day lock no one', async () => {
    // The morning's slips: 19 wrong tries from this tablet, none of the badges at its own limit.
    for (const badge of ['1041', '1042', '1043', '1044'])
      for (let i = 0; i < 4; i++) await wrongPin(badge).expect(401);
    for (let i = 0; i < 3; i++) await wrongPin('1045').expect(401);
    expect(row('ip:127.0.0.1')?.failures).toBe(19);
    vi.setSystemTime(Date.now() + 16 * MINUTE);
    // The afternoon's: four more from Sam, then his right PIN.
    for (let i = 0; i < 4; i++) await wrongPin('1046').expect(401);
    await rightPin('1046').expect(200);
    expect(row('ip:127.0.0.1')).toMatchObject({ failures: 4, lockStep: 0 });
  });

  it('counts each tablet behind a reverse proxy on this machine by the address the proxy passes on', async () => {
    const from = (address: string, badge: string, pin: string) =>
      sut.http().post('/api/auth/badge').set('x-forwarded-for', address).send({ badge, pin });
    for (const badge of ['1041', '1042', '1043', '1044'])
      for (let i = 0; i < 5; i++) await from('192.0.2.7', badge, '0000').expect(401);
    await from('192.0.2.7', '1046', '4321').expect(429);
    await from('192.0.2.8', '1046', '4321').expect(200);
  });

  it('counts loopback and IPv4-mapped addresses as one client', async () => {
    const throttle = sut.app.get(SignInThrottle);
    const forms = ['127.0.0.1', '::1', '::ffff:127.0.0.1', '0:0:0:0:0:0:0:1', '::ffff:7f00:1'];
    for (const [i, address] of forms.entries())
      await throttle.check(`email:guess${i}@example.test`, address, () => Promise.resolve(null));
    expect(row('ip:127.0.0.1')?.failures).toBe(forms.length);
  });
});

describe(clientAddressKey.name, () => {
  it('gives one key to the forms of one address, and an IPv6 client its /64', () => {
    expect(clientAddressKey('::1')).toBe('127.0.0.1');
    expect(clientAddressKey('::ffff:127.0.0.1')).toBe('127.0.0.1');
    expect(clientAddressKey('::ffff:192.0.2.7')).toBe('192.0.2.7');
    expect(clientAddressKey('2001:db8:1:2:aaaa::1')).toBe('2001:db8:1:2::/64');
    expect(clientAddressKey('2001:db8:1:2:bbbb::9')).toBe('2001:db8:1:2::/64');
    expect(clientAddressKey(undefined)).toBe('unknown');
  });
});

describe(waitWords.name, () => {
  it('says the wait in whole seconds, minutes or hours, rounded up', () => {
    expect(waitWords(1_000)).toBe('1 second');
    expect(waitWords(44_100)).toBe('45 seconds');
    expect(waitWords(60_000)).toBe('1 minute');
    expect(waitWords(61_000)).toBe('2 minutes');
    expect(waitWords(60 * MINUTE)).toBe('1 hour');
  });
});
