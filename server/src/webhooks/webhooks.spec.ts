import { and, eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  makeVin,
  type CreatedWebhook,
  type JobLineDto,
  type Page,
  type RepairOrderSummary,
  type WebhookDeliveryDto,
  type WebhookEnvelope,
  type WebhookEvent,
} from '@baytime/shared';
import { createApp } from '../app.js';
import { DB, type Db } from '../db/database.js';
import { auditLog, webhookDeliveries } from '../db/schema/index.js';
import { startHttpsReceiver, type HttpsReceiver, type ReceivedHook } from '../test-support/https-receiver.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { WebhookDeliverer } from './webhook-deliverer.service.js';
import { signWebhook, verifyWebhook } from './webhook-signature.js';

const envelope = (hook: ReceivedHook) => JSON.parse(hook.body) as WebhookEnvelope;
const header = (hook: ReceivedHook, name: string) => String(hook.headers[name]);

/** The foreman marks the first open line of an open RO done. */
async function finishOpenLine(sut: TestApp): Promise<JobLineDto> {
  const foreman = await sut.signIn(DEMO.foreman);
  const open = (
    await sut.http().get('/api/repair-orders?status=open').auth(foreman, { type: 'bearer' }).expect(200)
  ).body as Page<RepairOrderSummary>;
  const line = open.items.flatMap((ro) => ro.lines).find((l) => l.status !== 'done')!;
  await sut
    .http()
    .patch(`/api/job-lines/${line.id}`)
    .auth(foreman, { type: 'bearer' })
    .send({ status: 'done' })
    .expect(200);
  return line;
}

describe('webhooks', () => {
  let receiver: HttpsReceiver;
  let sut: TestApp;
  let owner: string;
  let secret: string;

  const register = (events: WebhookEvent[], url = receiver.url) =>
    sut.http().post('/api/webhooks').auth(owner, { type: 'bearer' }).send({ url, events });
  const deliveries = async () =>
    (await sut.http().get('/api/webhooks/deliveries').auth(owner, { type: 'bearer' }).expect(200))
      .body as Page<WebhookDeliveryDto>;
  beforeAll(async () => {
    receiver = await startHttpsReceiver();
    sut = await startTestApp({ BAYTIME_WEBHOOK_CA_FILE: receiver.caFile });
    owner = await sut.signIn(DEMO.owner);
    const created = await register(['job-line.finished', 'repair-order.ready']).expect(201);
    secret = (created.body as CreatedWebhook).secret;
  });
  afterAll(async () => {
    await sut.close();
    await receiver.close();
  });

  it('takes only https endpoints and shows the signing secret once', async () => {
    const refused = await register(['job-line.finished'], 'http://localhost:9/hooks').expect(400);
    expect(refused.body.issues).toEqual([{ path: ['url'], message: 'An https:// address' }]);
    expect(secret).toMatch(/^whsec_[A-Za-z0-9_-]{43}$/);
    const listed = await sut.http().get('/api/webhooks').auth(owner, { type: 'bearer' }).expect(200);
    expect(JSON.stringify(listed.body)).not.toContain(secret);
  });

  it('delivers a signed job-line.finished when a line is finished', async () => {
    const line = await finishOpenLine(sut);
    const hook = await receiver.next((h) => envelope(h).event === 'job-line.finished');
    const timestamp = header(hook, 'x-baytime-timestamp');
    expect(header(hook, 'x-baytime-signature')).toBe(signWebhook(secret, Number(timestamp), hook.body));
    expect(verifyWebhook(secret, timestamp, hook.body, header(hook, 'x-baytime-signature'))).toBe(true);
    expect(
      verifyWebhook('whsec_someone-else', timestamp, hook.body, header(hook, 'x-baytime-signature')),
    ).toBe(false);
    expect(Math.abs(Date.now() / 1000 - Number(timestamp))).toBeLessThan(60);
    expect(envelope(hook)).toMatchObject({
      event: 'job-line.finished',
      data: { jobLineId: line.id, title: line.title, externalRef: null },
    });
    const log = await deliveries();
    const logged = log.items.find((d) => d.id === Number(header(hook, 'x-baytime-delivery')))!;
    expect(logged).toMatchObject({ status: 'delivered', event: 'job-line.finished', url: receiver.url });
    expect(logged.attempts.map((a) => [a.status, a.error])).toEqual([[204, null]]);
  });

  it('retries with back-off after a failed attempt and logs each one', async () => {
    const deliverer = sut.app.get(WebhookDeliverer);
    receiver.answers.push(503);
    await finishOpenLine(sut);
    const failed = await receiver.next(
      (h) => envelope(h).event === 'job-line.finished' && h !== receiver.received[0],
    );
    const id = Number(header(failed, 'x-baytime-delivery'));
    const pending = (await deliveries()).items.find((d) => d.id === id)!;
    expect(pending.status).toBe('pending');
    expect(pending.attempts.map((a) => [a.status, a.error])).toEqual([[503, 'The receiver answered 503']]);
    const waitMs = Date.parse(pending.nextAttemptAt!) - Date.parse(pending.attempts[0]!.at);
    expect(waitMs).toBeGreaterThanOrEqual(30_000);
    expect(waitMs).toBeLessThanOrEqual(60_000);

    expect(await deliverer.flush(new Date(Date.now() + 1000))).toBe(0);
    expect(await deliverer.flush(new Date(Date.parse(pending.nextAttemptAt!) + 1))).toBeGreaterThanOrEqual(1);
    const retried = (await deliveries()).items.find((d) => d.id === id)!;
    expect(retried.status).toBe('delivered');
    expect(retried.attempts.map((a) => a.status)).toEqual([503, 204]);
    const bodies = receiver.received
      .filter((h) => header(h, 'x-baytime-delivery') === String(id))
      .map((h) => h.body);
    expect(new Set(bodies).size).toBe(1);
  });

  it('announces an RO ready when its last line is finished, and a finding answered', async () => {
    await register(['repair-order.ready', 'finding.answered']).expect(201);
    const foreman = await sut.signIn(DEMO.foreman);
    const ro = (
      await sut
        .http()
        .post('/api/repair-orders')
        .auth(foreman, { type: 'bearer' })
        .send({
          externalRef: 'HOOK-READY-1',
          customer: { name: 'Ada Fenwick' },
          vehicle: {
            vin: makeVin('1HGCM826A0043521'),
            year: 2010,
            make: 'Corvane',
            model: 'Sprite',
            odometer: 90_000,
          },
          concern: 'Wipers',
          lines: [{ title: 'Replace wiper blades', bookHours: 0.3 }],
        })
        .expect(201)
    ).body as RepairOrderSummary;
    const lineId = ro.lines[0]!.id;
    const finding = await sut
      .http()
      .post(`/api/job-lines/${lineId}/findings`)
      .auth(foreman, { type: 'bearer' })
      .field('note', 'Washer jet blocked')
      .field('severity', 'watch')
      .expect(201);
    const advisor = await sut.signIn(DEMO.advisor);
    await sut
      .http()
      .post(`/api/findings/${(finding.body as { id: number }).id}/answer`)
      .auth(advisor, { type: 'bearer' })
      .send({ answer: 'declined', channel: 'phone' })
      .expect(200);
    await sut
      .http()
      .patch(`/api/job-lines/${lineId}`)
      .auth(foreman, { type: 'bearer' })
      .send({ status: 'done' })
      .expect(200);

    const answered = await receiver.next((h) => envelope(h).event === 'finding.answered');
    expect(envelope(answered).data).toMatchObject({
      jobLineId: lineId,
      repairOrderId: ro.id,
      answer: 'declined',
    });
    const ready = await receiver.next(
      (h) =>
        envelope(h).event === 'repair-order.ready' &&
        (envelope(h).data as { repairOrderId: number }).repairOrderId === ro.id,
    );
    expect(envelope(ready).data).toMatchObject({ repairOrderId: ro.id, externalRef: 'HOOK-READY-1' });
  });

  it('announces an RO ready when its last open line is cancelled rather than finished', async () => {
    const foreman = await sut.signIn(DEMO.foreman);
    const ro = (
      await sut
        .http()
        .post('/api/repair-orders')
        .auth(foreman, { type: 'bearer' })
        .send({
          externalRef: 'HOOK-READY-2',
          customer: { name: 'Ada Fenwick' },
          vehicle: {
            vin: makeVin('1HGCM826A0043522'),
            year: 2010,
            make: 'Corvane',
            model: 'Sprite',
            odometer: 91_000,
          },
          concern: 'Service',
          lines: [
            { title: 'Oil service', bookHours: 0.8 },
            { title: 'Cabin filter', bookHours: 0.2 },
          ],
        })
        .expect(201)
    ).body as RepairOrderSummary;
    const [done, dropped] = ro.lines;
    await sut
      .http()
      .patch(`/api/job-lines/${done!.id}`)
      .auth(foreman, { type: 'bearer' })
      .send({ status: 'done' })
      .expect(200);
    await sut
      .http()
      .post(`/api/job-lines/${dropped!.id}/cancel`)
      .auth(foreman, { type: 'bearer' })
      .send({ reason: 'Customer declined the filter' })
      .expect(200);

    const ready = await receiver.next(
      (h) =>
        envelope(h).event === 'repair-order.ready' &&
        (envelope(h).data as { repairOrderId: number }).repairOrderId === ro.id,
    );
    expect(envelope(ready).data).toMatchObject({ externalRef: 'HOOK-READY-2', bayId: null });
  });

  it('keeps a pending delivery across a restart and sends it once the server is back', async () => {
    const db = sut.app.get<Db>(DB);
    const seen = receiver.received.length;
    receiver.answers.push(500);
    await finishOpenLine(sut);
    const first = await receiver.next((h) => receiver.received.indexOf(h) >= seen);
    const id = Number(header(first, 'x-baytime-delivery'));
    // The failed try is written down before the delivery is made due again.
    await sut.app.get(WebhookDeliverer).flush(new Date(0));
    db.update(webhookDeliveries).set({ nextAttemptAt: new Date() }).where(eq(webhookDeliveries.id, id)).run();

    await sut.app.close();
    sut.app = await createApp(sut.config, false);
    await sut.app.listen(0, '127.0.0.1');
    const again = await receiver.next(
      (h) => receiver.received.indexOf(h) > seen && header(h, 'x-baytime-delivery') === String(id),
    );
    expect(again.body).toBe(first.body);
    owner = await sut.signIn(DEMO.owner);
    expect((await deliveries()).items.find((d) => d.id === id)!.status).toBe('delivered');
  });
});

describe('webhook deliveries outside the tests', () => {
  let receiver: HttpsReceiver;
  let sut: TestApp;

  beforeAll(async () => {
    receiver = await startHttpsReceiver();
    sut = await startTestApp();
  });
  afterAll(async () => {
    await sut.close();
    await receiver.close();
  });

  it('do not trust a certificate no public CA signed', async () => {
    const owner = await sut.signIn(DEMO.owner);
    await sut
      .http()
      .post('/api/webhooks')
      .auth(owner, { type: 'bearer' })
      .send({ url: receiver.url, events: ['job-line.finished'] })
      .expect(201);
    await finishOpenLine(sut);
    await sut.app.get(WebhookDeliverer).flush();
    const log = (await sut.http().get('/api/webhooks/deliveries').auth(owner, { type: 'bearer' }))
      .body as Page<WebhookDeliveryDto>;
    expect(log.items[0]!.attempts[0]).toMatchObject({ status: null, error: 'self-signed certificate' });
    expect(receiver.received).toEqual([]);
  });
});

describe('stopping a webhook endpoint', () => {
  let receiver: HttpsReceiver;
  let sut: TestApp;
  let owner: string;

  const register = async () =>
    (
      (
        await sut
          .http()
          .post('/api/webhooks')
          .auth(owner, { type: 'bearer' })
          .send({ url: receiver.url, events: ['job-line.finished'] })
          .expect(201)
      ).body as CreatedWebhook
    ).webhook.id;
  const stop = (id: number) =>
    sut.http().delete(`/api/webhooks/${id}`).auth(owner, { type: 'bearer' }).expect(200);
  const logged = async (ids: number[]) =>
    (
      (await sut.http().get('/api/webhooks/deliveries').auth(owner, { type: 'bearer' }).expect(200))
        .body as Page<WebhookDeliveryDto>
    ).items
      .filter((delivery) => ids.includes(delivery.id))
      .sort((a, b) => a.id - b.id);
  const sentTo = (ids: number[]) =>
    receiver.received.filter((hook) => ids.includes(Number(header(hook, 'x-baytime-delivery'))));

  beforeAll(async () => {
    receiver = await startHttpsReceiver();
    sut = await startTestApp({ BAYTIME_WEBHOOK_CA_FILE: receiver.caFile });
    owner = await sut.signIn(DEMO.owner);
  });
  afterAll(async () => {
    await sut.close();
    await receiver.close();
  });

  it('cancels the deliveries still waiting for it, and never tries them again', async () => {
    const deliverer = sut.app.get(WebhookDeliverer);
    const webhookId = await register();
    receiver.answers.push(503);
    await finishOpenLine(sut);
    const id = Number(header(await receiver.next(), 'x-baytime-delivery'));
    // The failed try is written down before the endpoint is stopped.
    await deliverer.flush(new Date(0));
    await stop(webhookId);

    const [cancelled] = await logged([id]);
    expect(cancelled).toMatchObject({ status: 'cancelled', nextAttemptAt: null });
    expect(cancelled!.attempts.map((a) => a.status)).toEqual([503]);
    expect(await deliverer.flush(new Date(Date.now() + 2 * 24 * 3600_000))).toBe(0);
    expect(sentTo([id])).toHaveLength(1);
    const audited = sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'webhook'), eq(auditLog.action, 'revoke')))
      .get()!;
    expect(audited.detail).toEqual({ url: receiver.url, cancelledDeliveries: 1 });
  });

  it.each([
    [503, 'cancelled'],
    [204, 'delivered'],
  ] as const)(
    'sends nothing more of a batch once its endpoint is stopped; the try under way answered %i ends %s',
    async (answer, firstStatus) => {
      const webhookId = await register();
      const now = new Date();
      const due = {
        webhookId,
        event: 'job-line.finished' as const,
        body: '{}',
        nextAttemptAt: now,
        createdAt: now,
      };
      const ids = sut.app
        .get<Db>(DB)
        .insert(webhookDeliveries)
        .values([due, due])
        .returning({ id: webhookDeliveries.id })
        .all()
        .map((row) => row.id);
      receiver.answers.push(answer);
      receiver.beforeAnswer = async () => {
        receiver.beforeAnswer = null;
        await stop(webhookId);
      };

      await sut.app.get(WebhookDeliverer).flush();
      expect(sentTo(ids).map((hook) => Number(header(hook, 'x-baytime-delivery')))).toEqual([ids[0]]);
      expect((await logged(ids)).map((d) => [d.status, d.attempts.map((a) => a.status)])).toEqual([
        [firstStatus, [answer]],
        ['cancelled', []],
      ]);
    },
  );
});
