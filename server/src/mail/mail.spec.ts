import { mkdtempSync, rmSync } from 'node:fs';
import { createServer } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import MailComposer from 'nodemailer/lib/mail-composer';
import sharp from 'sharp';
import { eq } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
  retryDelayMs,
  type ApprovalRequested,
  type FindingDto,
  type MailboxEntry,
  type MailboxMessage,
  type MyDay,
  type NoticesQueued,
  type TextboxEntry,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { customers, findings, jobLines, mailOutbox, repairOrders, users } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { MAX_SEND_ATTEMPTS, OutboxService, SEND_RETRY } from './outbox.service.js';
import { readMail } from './read-mail.js';
import { TextboxService } from './textbox.service.js';

/** A loopback port nothing listens on: connecting to it is refused at once. */
async function deadPort(): Promise<number> {
  const server = createServer();
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  const { port } = server.address() as { port: number };
  await new Promise((resolve) => server.close(resolve));
  return port;
}

async function eventually<T>(probe: () => Promise<T | undefined>, timeoutMs = 5000): Promise<T> {
  const until = Date.now() + timeoutMs;
  for (;;) {
    const found = await probe();
    if (found !== undefined) return found;
    if (Date.now() > until) throw new Error('Not within the time allowed');
    await new Promise((resolve) => setTimeout(resolve, 50));
  }
}

describe(OutboxService.name, () => {
  describe('readMail', () => {
    it('reads back what nodemailer composes: encoded subject, quoted-printable text, attachment names', async () => {
      const raw = await new MailComposer({
        from: '"Marlow Creek Auto Care" <owner@marlowcreek.test>',
        to: 'harriet@example.test, "Quenby, H." <h.q@example.test>',
        subject: 'Approval needed – Bremsbeläge für RO 4521',
        text: `Line one with ünïcödé\n${'A long line that nodemailer wraps. '.repeat(6)}`,
        attachments: [
          { filename: 'photo-1.png', content: Buffer.from('not really a png') },
          { filename: 'Fotó 2.jpg', content: Buffer.alloc(300, 1) },
        ],
      })
        .compile()
        .build();
      const parsed = await readMail(raw);
      expect(parsed.subject).toBe('Approval needed – Bremsbeläge für RO 4521');
      expect(parsed.to).toEqual(['harriet@example.test', '"Quenby, H." <h.q@example.test>']);
      expect(parsed.text.trim()).toBe(
        `Line one with ünïcödé\n${'A long line that nodemailer wraps. '.repeat(6)}`.trim(),
      );
      expect(parsed.attachments).toEqual([
        { filename: 'photo-1.png', contentType: 'image/png', sizeBytes: 16 },
        { filename: 'Fotó 2.jpg', contentType: 'image/jpeg', sizeBytes: 300 },
      ]);
    });
  });

  describe('with the local fake SMTP server', () => {
    let sut: TestApp;
    let db: Db;
    let owner: string;
    let advisor: string;
    const mailbox = async (token = owner) =>
      (await sut.http().get('/api/mailbox').auth(token, { type: 'bearer' }).expect(200)).body
        .items as MailboxEntry[];
    const received = (subject: string) =>
      eventually(async () => (await mailbox()).find((entry) => entry.subject === subject));

    beforeAll(async () => {
      sut = await startTestApp();
      db = sut.app.get<Db>(DB);
      owner = await sut.signIn(DEMO.owner);
      advisor = await sut.signIn(DEMO.advisor);
    });
    afterAll(() => sut.close());

    it('delivers an approval request over SMTP with the right recipient, subject and photo', async () => {
      const dana = await sut.badge('1041');
      const day = (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' }))
        .body as MyDay;
      const line = day.lines.find((l) => l.clockedOn)!;
      const photo = await sharp({ create: { width: 80, height: 60, channels: 3, background: '#444' } })
        .png()
        .toBuffer();
      const finding = (
        await sut
          .http()
          .post(`/api/job-lines/${line.id}/findings`)
          .auth(dana.accessToken, { type: 'bearer' })
          .field('note', 'Oil pan drain plug threads stripped')
          .field('severity', 'soon')
          .field('suggestedHours', '0.7')
          .attach('photos', photo, { filename: 'plug.png', contentType: 'image/png' })
          .expect(201)
      ).body as FindingDto;

      await sut
        .http()
        .patch(`/api/findings/${finding.id}/quote`)
        .auth(advisor, { type: 'bearer' })
        .send({ customerWording: 'The drain plug threads are worn out', bookHours: 0.7, partsCents: 12_50 })
        .expect(200);
      const request = () =>
        sut.http().post(`/api/findings/${finding.id}/request-approval`).auth(advisor, { type: 'bearer' });
      const ro = db.select().from(repairOrders).where(eq(repairOrders.id, finding.repairOrderId)).get()!;
      db.update(customers)
        .set({ email: null, phone: '555-0142' })
        .where(eq(customers.id, ro.customerId))
        .run();
      const { body: refused } = await request().expect(400);
      expect(refused.message).toBe('The customer has no e-mail address or phone number for texts');

      db.update(customers)
        .set({ email: 'harriet@example.test', phone: '(608) 555-0177' })
        .where(eq(customers.id, ro.customerId))
        .run();
      const subject = `Marlow Creek Auto Care: approval needed for RO ${ro.number}`;
      // Stored to the second: the request's time, floored.
      const requestedFrom = Math.floor(Date.now() / 1000) * 1000;
      const queued = (await request().expect(201)).body as ApprovalRequested;
      expect(queued.mail).toMatchObject({
        to: 'harriet@example.test',
        subject,
        attachments: ['finding-1-photo-1.png'],
      });
      expect(queued.text).toMatchObject({ to: '+16085550177' });
      const requestedTo = Date.now();

      const entry = await received(subject);
      expect(entry).toMatchObject({
        from: 'Marlow Creek Auto Care <owner@marlowcreek.test>',
        to: ['harriet@example.test'],
        attachments: ['finding-1-photo-1.png'],
      });
      const message = (
        await sut.http().get(`/api/mailbox/${entry.id}`).auth(owner, { type: 'bearer' }).expect(200)
      ).body as MailboxMessage;
      // 0.7 h × $135.00 = $94.50, + $12.50 parts = $107.00 (worked by hand).
      expect(message.text).toContain('- The drain plug threads are worn out (estimate $107.00)');
      expect(message.text).not.toContain('Oil pan drain plug threads stripped');
      expect(message.text).toContain(queued.approvalUrl);
      expect(message.text).not.toMatch(/<img/i);
      expect(db.select().from(mailOutbox).where(eq(mailOutbox.id, queued.mail!.mailId)).get()).toMatchObject({
        channel: 'email',
        status: 'sent',
        attempts: 1,
      });

      const text = await eventually(async () => {
        const { body } = await sut.http().get('/api/textbox').auth(owner, { type: 'bearer' }).expect(200);
        return (body.items as TextboxEntry[]).find((t) => t.body.includes(queued.approvalUrl));
      });
      expect(text.to).toBe('+16085550177');
      expect(text.body).toMatch(
        /^Marlow Creek Auto Care: we found something on your .+ Estimate \$107\.00\./,
      );

      // The new finding also told the RO's advisor.
      const notice = await received(`Marlow Creek Auto Care: new finding on RO ${ro.number} (Fix soon)`);
      expect(notice.to).toEqual([DEMO.advisor]);

      const inbox = (await sut.http().get('/api/findings').auth(advisor, { type: 'bearer' })).body
        .items as FindingDto[];
      const requestedAt = Date.parse(inbox.find((f) => f.id === finding.id)?.approvalRequestedAt ?? '');
      expect(requestedAt).toBeGreaterThanOrEqual(requestedFrom);
      expect(requestedAt).toBeLessThanOrEqual(requestedTo);
    });

    it('sends the ready notice only when every line of the RO is done', async () => {
      const notice = (id: number) =>
        sut.http().post(`/api/repair-orders/${id}/ready-notice`).auth(advisor, { type: 'bearer' });
      const open = db.select().from(jobLines).where(eq(jobLines.status, 'queued')).get()!;
      const { body: refused } = await notice(open.repairOrderId).expect(409);
      expect(refused.message).toMatch(/^The work on RO \d+ is not done yet/);

      const done = db.select().from(repairOrders).where(eq(repairOrders.status, 'done')).get()!;
      db.update(customers)
        .set({ email: 'ready@example.test' })
        .where(eq(customers.id, done.customerId))
        .run();
      const doneLine = db.select().from(jobLines).where(eq(jobLines.repairOrderId, done.id)).get()!;
      const declined = {
        jobLineId: doneLine.id,
        technicianId: db.select().from(users).where(eq(users.role, 'technician')).get()!.id,
        severity: 'watch' as const,
        answer: 'declined' as const,
      };
      db.insert(findings)
        .values([
          {
            ...declined,
            note: 'LR wiper chattering',
            customerWording: 'The rear wiper blade is worn',
            createdAt: new Date(),
          },
          { ...declined, note: 'raw tech shorthand: CV boot sm tear', createdAt: new Date() },
        ])
        .run();
      const queued = (await notice(done.id).expect(202)).body as NoticesQueued;
      expect(queued.mail?.subject).toMatch(
        new RegExp(`^Marlow Creek Auto Care: your .+ is ready \\(RO ${done.number}\\)$`),
      );
      const entry = await received(queued.mail!.subject);
      expect(entry.to).toEqual(['ready@example.test']);
      const { text } = (
        await sut.http().get(`/api/mailbox/${entry.id}`).auth(owner, { type: 'bearer' }).expect(200)
      ).body as MailboxMessage;
      expect(text).toContain('- The rear wiper blade is worn');
      expect(text).toContain(
        `- Something our technician noted during "${doneLine.title}": ask us for the details`,
      );
      expect(text).not.toMatch(/LR wiper|raw tech shorthand/);
      const ro = db.select().from(customers).where(eq(customers.id, done.customerId)).get()!;
      expect(queued.text).toEqual({ textId: expect.any(Number), to: ro.phone });
    });

    it('sends a text through the local text box, and retries one that failed with back-off', async () => {
      const outbox = sut.app.get(OutboxService);
      const textbox = sut.app.get(TextboxService);
      await outbox.flush();
      const record = vi.spyOn(textbox, 'record').mockImplementationOnce(() => {
        throw new Error('Text box unreachable');
      });
      const { id } = outbox.queueText({ to: '+16085550123', body: 'Your car is ready' });
      await outbox.flush();
      expect(outbox.find(id)).toMatchObject({
        channel: 'text',
        status: 'queued',
        attempts: 1,
        lastError: 'Text box unreachable',
      });
      const due = outbox.find(id)!.nextAttemptAt;
      expect(due.getTime() - outbox.find(id)!.createdAt.getTime()).toBeGreaterThanOrEqual(
        retryDelayMs(1, SEND_RETRY),
      );

      expect(await outbox.flush(due)).toBe(1);
      expect(outbox.find(id)).toMatchObject({ status: 'sent', attempts: 2, lastError: null });
      expect(record).toHaveBeenLastCalledWith('Baytime local text box', '+16085550123', 'Your car is ready');
      const { body } = await sut.http().get('/api/textbox').auth(owner, { type: 'bearer' }).expect(200);
      expect((body.items as TextboxEntry[])[0]).toMatchObject({
        to: '+16085550123',
        body: 'Your car is ready',
      });
      record.mockRestore();
    });

    it('shows the mailbox to the owner only', async () => {
      await sut.http().get('/api/mailbox').auth(advisor, { type: 'bearer' }).expect(403);
      await sut
        .http()
        .get('/api/mailbox/00000000-0000-4000-8000-000000000000')
        .auth(owner, { type: 'bearer' })
        .expect(404);
      await sut.http().get('/api/mailbox/..%2Fjwt-secret').auth(owner, { type: 'bearer' }).expect(400);
    });
  });

  describe('when sending fails', () => {
    const dataDir = mkdtempSync(join(tmpdir(), 'baytime-mail-'));
    afterAll(() => rmSync(dataDir, { recursive: true, force: true }));

    it('retries with exponential back-off and keeps the message across a restart', async () => {
      expect([1, 2, 3, 7].map((failed) => retryDelayMs(failed, SEND_RETRY))).toEqual([
        60_000, 120_000, 240_000, 3_840_000,
      ]);
      const broken = await startTestApp({
        BAYTIME_DATA_DIR: dataDir,
        BAYTIME_SMTP_URL: `smtp://127.0.0.1:${await deadPort()}`,
      });
      const mail = broken.app.get(OutboxService);
      const row = (id: number) => mail.find(id)!;

      // A message gives up after the last attempt and is then left alone.
      const doomed = mail.queueMail({ to: 'nobody@example.test', subject: 'Never sent', text: 'x' }).id;
      await mail.flush();
      for (let i = 1; i < MAX_SEND_ATTEMPTS; i++)
        await mail.flush(new Date(Date.now() + 365 * 86_400_000 * i));
      expect(row(doomed)).toMatchObject({ status: 'failed', attempts: MAX_SEND_ATTEMPTS });
      await mail.flush(new Date(Date.now() + 3650 * 86_400_000));
      expect(row(doomed).attempts).toBe(MAX_SEND_ATTEMPTS);

      const { id } = mail.queueMail({
        to: 'later@example.test',
        subject: 'Survives a restart',
        text: 'Hello',
      });
      await mail.flush();
      expect(row(id)).toMatchObject({ status: 'queued', attempts: 1 });
      expect(row(id).lastError).toMatch(/ECONNREFUSED/);
      const firstDelay = row(id).nextAttemptAt.getTime() - Date.now();
      expect(firstDelay).toBeGreaterThan(50_000);
      expect(firstDelay).toBeLessThanOrEqual(60_000);

      // Not due yet: nothing is tried.
      await mail.flush();
      expect(row(id).attempts).toBe(1);
      for (const [attempt, delay] of [
        [2, 120_000],
        [3, 240_000],
      ] as const) {
        const due = row(id).nextAttemptAt;
        await mail.flush(due);
        expect(row(id)).toMatchObject({ status: 'queued', attempts: attempt });
        expect(row(id).nextAttemptAt.getTime() - due.getTime()).toBe(delay);
      }

      await broken.close();

      const restarted = await startTestApp({ BAYTIME_DATA_DIR: dataDir });
      try {
        const again = restarted.app.get(OutboxService);
        expect(again.find(id)).toMatchObject({ status: 'queued', attempts: 3 });
        expect(await again.flush(again.find(id)!.nextAttemptAt)).toBe(1);
        expect(again.find(id)).toMatchObject({ status: 'sent', attempts: 4, lastError: null });
        const owner = await restarted.signIn(DEMO.owner);
        const { body } = await restarted
          .http()
          .get('/api/mailbox')
          .auth(owner, { type: 'bearer' })
          .expect(200);
        expect((body.items as MailboxEntry[]).map((entry) => entry.subject)).toEqual(['Survives a restart']);
      } finally {
        await restarted.close();
      }
    });
  });
});
