import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { eq } from 'drizzle-orm';
import { PAGE_LIMIT_MAX, type Role } from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { randomUUID } from 'node:crypto';
import {
  customers,
  findings,
  jobLines,
  offlinePunches,
  repairOrders,
  screens,
  users,
  vehicles,
  webhookDeliveries,
  webhooks,
} from '../db/schema/index.js';
import { OutboxService } from '../mail/outbox.service.js';
import { PUBLIC_GET_ROUTES, ROUTES } from '../test-support/routes.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';

/** Lists whose length the shop sets by its size, not by the years it has used Baytime. */
const ACCEPTED_LISTS: Record<string, string> = {
  '/api/users': 'the shop’s people, added one by one by the owner',
  '/api/bays': 'the shop’s bays: 4 to 30 in a real shop',
  '/api/operations': 'the shop’s menu of operations, kept by the owner',
  '/api/hold-presets': 'named fixed waits the owner sets up',
  '/api/screens': 'the wall screens the shop paired',
  '/api/integration-keys': 'the keys the owner made, one per system the shop connects',
  '/api/webhooks': 'the endpoints the owner registered, one per system the shop connects',
  '/api/kiosks': 'the kiosk tablets the shop paired',
  '/api/timers': 'running timers only: at most one per line in work, a stopped one drops out',
  '/api/shop/pay-rules': 'the shop’s pay rules: one per change of the rules the owner made',
};

/** Answers that are one thing, or a view bounded by the floor or by one week, not a list of records. */
const NOT_LISTS: Record<string, string> = {
  '/api/me': 'the caller',
  '/api/me/day': 'one technician’s open lines today',
  '/api/shop': 'the shop’s settings',
  '/api/health': 'a health check',
  '/api/openapi.json': 'the API’s description',
  '/api/docs': 'the API reference page',
  '/api/kiosks/me/offline-key': 'the server’s public key for offline sign-ins',
  '/api/board': 'the floor now: bays, people in, open lines',
  '/api/dispatch': 'the floor now: open lines per technician',
  '/api/vehicles': 'one vehicle, found by VIN',
  '/api/timecards': 'one technician’s workweek',
  '/api/reports/labour': 'one workweek, a row per technician',
  '/api/reports/pay': 'one workweek, a row per technician',
  '/api/exceptions': 'one workweek’s timecard exceptions',
};

/** Routes that answer only while the bench runs the server, with the reason. */
const BENCH_ONLY: Record<string, string> = {
  '/api/health/event-loop': 'event-loop delay figures; 404 unless BAYTIME_BENCH_METRICS is set',
};

/** Paged lists seeded with a few rows only: each costs too much to make more than a page of. */
const FEW: Record<string, string> = {
  '/api/mailbox': 'each message crosses the local SMTP server',
  '/api/textbox': 'each text goes through the outbox',
};

/** Query strings a route needs to answer at all. */
const SAMPLE_QUERIES: Record<string, string> = {
  '/api/vehicles': 'vin=1M8GDM9AXKP042788',
};

describe('every GET collection route is bounded', () => {
  let sut: TestApp;
  const tokens = {} as Record<Role, string>;
  /** Every GET route the server serves without a path parameter (one with `:id` names one thing). */
  let collections: string[];

  const get = async (path: string, query = '') => {
    const allowed = ROUTES.find(([method, route]) => method === 'get' && route === path)?.[2] ?? [];
    const token = allowed[0] ? tokens[allowed[0]] : undefined;
    const sample = SAMPLE_QUERIES[path];
    const search = [sample, query].filter(Boolean).join('&');
    const request = sut.http().get(search ? `${path}?${search}` : path);
    return (token ? request.auth(token, { type: 'bearer' }) : request).expect(200);
  };

  beforeAll(async () => {
    sut = await startTestApp();
    tokens.owner = await sut.signIn(DEMO.owner);
    tokens.foreman = await sut.signIn(DEMO.foreman);
    tokens.advisor = await sut.signIn(DEMO.advisor);
    tokens.technician = (await sut.badge('1044')).accessToken;
    const kiosk = await sut
      .http()
      .post('/api/kiosks')
      .auth(tokens.owner, { type: 'bearer' })
      .send({ name: 'Kiosk' });
    tokens.kiosk = (
      await sut.http().post('/api/auth/kiosks/pair').send({ code: kiosk.body.code })
    ).body.accessToken;
    const express = sut.app.getHttpAdapter().getInstance() as {
      router: { stack: { route?: { path: string; methods: Record<string, boolean> } }[] };
    };
    collections = express.router.stack
      .flatMap(({ route }) => (route?.methods.get && !route.path.includes(':') ? [route.path] : []))
      // The reference page's own files.
      .filter((path) => !path.startsWith('/api/docs/'))
      .filter((path) => !(path in BENCH_ONLY))
      .sort();

    // More ROs and findings than a page holds, so a limit that is not clamped shows; the mailbox gets a
    // few (each message crosses SMTP), enough to page through.
    const db = sut.app.get<Db>(DB);
    const at = new Date(Date.UTC(2030, 0, 7, 15));
    const customerId = db
      .insert(customers)
      .values({ name: 'Bulk Customer', createdAt: at })
      .returning()
      .get().id;
    const vehicleId = db
      .insert(vehicles)
      .values({ customerId, vin: '1M8GDM9AXKP042788', year: 2019, make: 'Halvard', model: 'Morrow' })
      .returning()
      .get().id;
    const technicianId = db.select().from(users).where(eq(users.badge, '1044')).get()!.id;
    for (let i = 0; i <= PAGE_LIMIT_MAX; i++) {
      const repairOrderId = db
        .insert(repairOrders)
        .values({
          number: String(900_000 + i),
          customerId,
          vehicleId,
          customerName: 'Bulk Customer',
          vehicleYear: 2019,
          vehicleMake: 'Halvard',
          vehicleModel: 'Morrow',
          concern: 'Bulk',
          odometer: 1000,
          createdAt: at,
        })
        .returning()
        .get().id;
      const jobLineId = db
        .insert(jobLines)
        .values({
          repairOrderId,
          lineNo: 1,
          title: 'Bulk',
          bookHours: 1,
          queuedAt: at,
          updatedAt: at,
          status: 'done',
        })
        .returning()
        .get().id;
      db.insert(findings)
        .values({ jobLineId, technicianId, note: 'Bulk', severity: 'watch', createdAt: at })
        .run();
    }
    const webhookId = db
      .insert(webhooks)
      .values({
        url: 'https://hooks.example.test/',
        events: ['job-line.finished'],
        secret: 'x',
        createdBy: technicianId,
        createdAt: at,
      })
      .returning()
      .get().id;
    for (let i = 0; i <= PAGE_LIMIT_MAX; i++)
      db.insert(webhookDeliveries)
        .values({ webhookId, event: 'job-line.finished', body: '{}', createdAt: at })
        .run();
    const kioskId = db.select().from(screens).where(eq(screens.kind, 'kiosk')).get()!.id;
    for (let i = 0; i <= PAGE_LIMIT_MAX; i++)
      db.insert(offlinePunches)
        .values({
          id: randomUUID(),
          kioskId,
          kind: 'shift-in',
          at: new Date(at.getTime() + (i % 7) * 60_000),
          status: 'refused',
          problem: 'Wrong PIN',
          receivedAt: at,
        })
        .run();
    const mail = sut.app.get(OutboxService);
    for (let i = 0; i < 3; i++) {
      mail.queueMail({ to: 'bulk@example.test', subject: `Bulk ${i}`, text: 'Bulk' });
      mail.queueText({ to: '+16085550123', body: `Bulk ${i}` });
    }
    await mail.flush();
  });
  afterAll(() => sut.close());

  it('walks every GET route the server has', () => {
    const walked = [
      ...PUBLIC_GET_ROUTES,
      ...ROUTES.filter(([method]) => method === 'get').map(([, path]) => path),
    ];
    expect(collections.filter((path) => !walked.includes(path))).toEqual([]);
    expect(collections).toContain('/api/repair-orders');
  });

  it('each one is a page with a clamped limit, a list bounded by the shop’s size, or no list', async () => {
    for (const path of collections) {
      const { body } = await get(path);
      if (path in ACCEPTED_LISTS || path in NOT_LISTS) {
        expect(Array.isArray(body), `${path} is ${path in NOT_LISTS ? 'no list' : 'a list'}`).toBe(
          path in ACCEPTED_LISTS,
        );
        continue;
      }
      expect(Object.keys(body as object).sort(), `${path} answers a page`).toEqual([
        'items',
        'nextCursor',
        'total',
      ]);
      const one = (await get(path, 'limit=1')).body as {
        items: unknown[];
        nextCursor: string | null;
        total: number;
      };
      expect(one.items, `${path}?limit=1`).toHaveLength(1);
      const many = (await get(path, 'limit=100000')).body as { items: unknown[]; total: number };
      if (path in FEW) expect(many.total, `${path} holds a few`).toBeGreaterThan(1);
      else expect(many.total, `${path} holds more than a page`).toBeGreaterThan(PAGE_LIMIT_MAX);
      expect(many.items, `${path}?limit=100000`).toHaveLength(Math.min(many.total, PAGE_LIMIT_MAX));
      const next = (await get(path, `limit=1&cursor=${one.nextCursor}`)).body as { items: unknown[] };
      expect(next.items, `${path} next page`).not.toEqual(one.items);
    }
  });
});
