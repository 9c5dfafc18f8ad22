import sharp from 'sharp';
import { and, eq, ne } from 'drizzle-orm';
import { afterAll, beforeAll, describe, expect, it, vi } from 'vitest';
import {
  makeVin,
  type ApprovalRequested,
  type BoardSnapshot,
  type FindingDto,
  type MailboxEntry,
  type MyDay,
  type PublicApproval,
  type PublicApprovalResult,
  type RepairOrderSummary,
} from '@baytime/shared';
import { DB, SQLITE, type Db, type Sqlite } from '../db/database.js';
import { OutboxService } from '../mail/outbox.service.js';
import { approvalLinks, auditLog, findings, jobLines } from '../db/schema/index.js';
import { tableDigests } from '../test-support/table-digests.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { APPROVAL_MISSES_ALLOWED } from './approval-throttle.js';
import { hashApprovalToken } from './approval-token.js';
import { ApprovalsService } from './approvals.service.js';

const tokenOf = (url: string) => url.split('/approve/')[1]!;

describe(ApprovalsService.name, () => {
  let sut: TestApp;
  let db: Db;
  let owner: string;
  let advisor: string;
  let foreman: string;
  let dana: string;
  let png: Buffer;

  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  const tablesHolding = (text: string) => {
    const { connection } = sut.app.get<Sqlite>(SQLITE);
    const tables = connection
      .prepare("select name from pragma_table_list where schema = 'main' and type = 'table'")
      .all() as { name: string }[];
    return tables
      .filter(({ name }) =>
        JSON.stringify(connection.prepare(`select * from "${name}"`).all()).includes(text),
      )
      .map(({ name }) => name);
  };
  const page = (token: string) => sut.http().get(`/api/public/approvals/${token}`);
  const answer = (token: string, body: object) =>
    sut.http().post(`/api/public/approvals/${token}`).set('User-Agent', 'PhoneBrowser/1.0').send(body);

  /** A finding recorded on a line, with a photo, then quoted by the advisor. */
  async function quotedFinding(
    technician: string,
    lineId: number,
    note: string,
    quote: { customerWording: string; bookHours: number; partsCents?: number | null },
  ): Promise<FindingDto> {
    const created = (
      await sut
        .http()
        .post(`/api/job-lines/${lineId}/findings`)
        .auth(technician, { type: 'bearer' })
        .field('note', note)
        .field('severity', 'soon')
        .field('holdForApproval', 'true')
        .attach('photos', png, { filename: 'photo.png', contentType: 'image/png' })
        .expect(201)
    ).body as FindingDto;
    return (await as(advisor).patch(`/api/findings/${created.id}/quote`, quote).expect(200))
      .body as FindingDto;
  }

  beforeAll(async () => {
    sut = await startTestApp();
    db = sut.app.get<Db>(DB);
    owner = await sut.signIn(DEMO.owner);
    advisor = await sut.signIn(DEMO.advisor);
    foreman = await sut.signIn(DEMO.foreman);
    dana = (await sut.badge('1041')).accessToken;
    png = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#7a4b2c' } })
      .png()
      .toBuffer();
  });
  afterAll(() => sut.close());

  describe('a customer answers from the link', () => {
    let first: FindingDto;
    let second: FindingDto;
    let sent: ApprovalRequested;

    beforeAll(async () => {
      const day = (await as(dana).get('/api/me/day').expect(200)).body as MyDay;
      const line = day.lines.find((l) => l.clockedOn)!;
      first = await quotedFinding(dana, line.id, 'pan gasket weeping, shavings', {
        customerWording: 'The transmission pan gasket leaks and should be replaced',
        bookHours: 1.5,
        partsCents: 42_80,
      });
      second = await quotedFinding(dana, line.id, 'wiper blades torn', {
        customerWording: 'The wiper blades are torn',
        bookHours: 0.8,
        partsCents: null,
      });
    });

    it('refuses to send a finding the advisor has not reviewed', async () => {
      const day = (await as(dana).get('/api/me/day').expect(200)).body as MyDay;
      const raw = (
        await sut
          .http()
          .post(`/api/job-lines/${day.lines[0]!.id}/findings`)
          .auth(dana, { type: 'bearer' })
          .field('note', 'raw note only')
          .field('severity', 'watch')
          .expect(201)
      ).body as FindingDto;
      const { body } = await as(advisor).post(`/api/findings/${raw.id}/request-approval`).expect(409);
      expect(body.message).toBe('Review the wording and the price before sending');
      await as(advisor).post(`/api/findings/${raw.id}/answer`, { answer: 'declined', channel: 'phone' });
    });

    it('sends one link for the reviewed findings of the RO and keeps only its hash', async () => {
      const office = sut.connect(foreman);
      await nextEvent(office, 'board.snapshot');
      const told = nextEvent(office, 'repair-order.updated', (e) => e.repairOrderId === first.repairOrderId);
      sent = (await as(advisor).post(`/api/findings/${first.id}/request-approval`).expect(201))
        .body as ApprovalRequested;
      // Other office windows show the finding as sent without a reload.
      expect(await told).toMatchObject({ repairOrderId: first.repairOrderId });
      expect(sent.findingIds).toEqual([first.id, second.id]);
      expect(sent.approvalUrl).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/approve\/[A-Za-z0-9_-]{43}$/);
      const token = tokenOf(sent.approvalUrl);
      const row = db.select().from(approvalLinks).where(eq(approvalLinks.id, sent.link.id)).get()!;
      expect(row.tokenHash).toBe(hashApprovalToken(token));
      // Once the messages went out, no table holds the token itself.
      await sut.app.get(OutboxService).flush();
      expect(tablesHolding(token)).toEqual([]);
      // 72 hours by default.
      expect(Date.parse(sent.expiresAt) - row.createdAt.getTime()).toBe(72 * 3_600_000);
    });

    it('attaches each finding’s photo under a name of its own', async () => {
      // Each finding has one photo: numbered per finding alone, both would arrive as photo-1.png.
      const names = ['finding-1-photo-1.png', 'finding-2-photo-1.png'];
      expect(sent.mail).toMatchObject({ attachments: names });
      await sut.app.get(OutboxService).flush();
      await vi.waitFor(
        async () => {
          const { body } = await as(owner).get('/api/mailbox').expect(200);
          const mail = (body.items as MailboxEntry[]).filter((entry) =>
            entry.subject.includes('approval needed for RO'),
          );
          expect(mail).toHaveLength(1);
          expect(mail[0]!.attachments).toEqual(names);
        },
        { timeout: 5000, interval: 50 },
      );
    });

    it('shows the quoted prices, worked out as hours × rate + parts', async () => {
      const { body } = await page(tokenOf(sent.approvalUrl)).expect(200);
      const view = body as PublicApproval;
      // The page states the link's expiry on the shop's clock, not the phone's.
      expect(view.shop).toEqual({
        name: 'Marlow Creek Auto Care',
        phone: '+16085550100',
        timeZone: 'America/Chicago',
      });
      expect(view.labourRateCents).toBe(135_00);
      // 1.5 h × $135.00 = $202.50, + $42.80 parts = $245.30; 0.8 h × $135.00 = $108.00;
      // total $353.30 (worked by hand).
      expect(
        view.findings.map(({ id, wording, labourCents, partsCents, priceCents }) => ({
          id,
          wording,
          labourCents,
          partsCents,
          priceCents,
        })),
      ).toEqual([
        {
          id: first.id,
          wording: 'The transmission pan gasket leaks and should be replaced',
          labourCents: 202_50,
          partsCents: 42_80,
          priceCents: 245_30,
        },
        {
          id: second.id,
          wording: 'The wiper blades are torn',
          labourCents: 108_00,
          partsCents: 0,
          priceCents: 108_00,
        },
      ]);
      expect(view.totalCents).toBe(353_30);
      expect(JSON.stringify(view)).not.toContain('pan gasket weeping');
    });

    it('serves the photos through the token only', async () => {
      const token = tokenOf(sent.approvalUrl);
      const view = (await page(token).expect(200)).body as PublicApproval;
      const photo = view.findings[0]!.photos[0]!;
      const served = await sut.http().get(photo.previewUrl).expect(200);
      expect(served.headers['content-type']).toBe('image/jpeg');
      const original = await sut.http().get(photo.url).expect(200);
      expect(original.headers['content-type']).toBe('image/png');

      const photoId = photo.url.split('/').at(-1)!;
      await sut.http().get(`/api/attachments/${photoId}`).expect(401);
      const wrong = 'A'.repeat(43);
      await sut.http().get(`/api/public/approvals/${wrong}/photos/${photoId}`).expect(404);
    });

    it('records the answers once: a line for the yes, the hold released, the office and the technician told', async () => {
      const token = tokenOf(sent.approvalUrl);
      const office = sut.connect(advisor);
      const kiosk = sut.connect(dana);
      await Promise.all([nextEvent(office, 'board.snapshot'), nextEvent(kiosk, 'board.snapshot')]);
      const heard = nextEvent(office, 'finding.answered', (event) => event.findingId === second.id);
      const heardOnKiosk = nextEvent(kiosk, 'finding.answered', (event) => event.findingId === first.id);
      const linesBefore = db
        .select()
        .from(jobLines)
        .where(eq(jobLines.repairOrderId, first.repairOrderId))
        .all();

      const { body } = await answer(token, {
        answers: [
          { findingId: first.id, answer: 'approved' },
          { findingId: second.id, answer: 'declined' },
        ],
        signedName: 'Harriet Quenby',
      }).expect(200);
      expect(body as PublicApprovalResult).toMatchObject({
        signedName: 'Harriet Quenby',
        approvedCents: 245_30,
      });
      expect(await heard).toMatchObject({
        jobLineId: second.jobLineId,
        note: 'wiper blades torn',
        answer: 'declined',
        channel: 'link',
      });
      // The kiosk quotes the finding in its notice of why the held line is back.
      expect(await heardOnKiosk).toMatchObject({
        jobLineId: first.jobLineId,
        note: 'pan gasket weeping, shavings',
        answer: 'approved',
        channel: 'link',
      });

      const added = db
        .select()
        .from(jobLines)
        .where(eq(jobLines.repairOrderId, first.repairOrderId))
        .all()
        .filter((line) => !linesBefore.some((before) => before.id === line.id));
      expect(added).toMatchObject([
        {
          title: 'The transmission pan gasket leaks and should be replaced',
          bookHours: 1.5,
          status: 'queued',
        },
      ]);
      const held = db.select().from(jobLines).where(eq(jobLines.id, first.jobLineId)).get()!;
      expect(held).toMatchObject({ status: 'queued', holdReason: null });
      const board = (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
      expect(board.queue.map((item) => item.jobLineId)).toContain(added[0]!.id);

      const inbox = (await as(advisor).get(`/api/findings?repairOrderId=${first.repairOrderId}`).expect(200))
        .body.items as FindingDto[];
      expect(inbox.find((f) => f.id === first.id)).toMatchObject({
        answer: 'approved',
        answerChannel: 'link',
        answeredBy: 'Harriet Quenby',
        createdLineId: added[0]!.id,
        approvalLink: { id: sent.link.id, status: 'used' },
      });
      const link = db.select().from(approvalLinks).where(eq(approvalLinks.id, sent.link.id)).get()!;
      expect(link).toMatchObject({ signedName: 'Harriet Quenby', answeredUserAgent: 'PhoneBrowser/1.0' });
      expect(link.answeredIp).toMatch(/127\.0\.0\.1$/);
      const audited = db
        .select()
        .from(auditLog)
        .where(and(eq(auditLog.entity, 'approval-link'), eq(auditLog.action, 'customer-answer')))
        .get()!;
      expect(audited).toMatchObject({ actorId: null, entityId: String(sent.link.id) });
      expect(audited.detail).toMatchObject({ signedName: 'Harriet Quenby', userAgent: 'PhoneBrowser/1.0' });
    });

    it('answers 410 once the link was used, and changes nothing', async () => {
      const token = tokenOf(sent.approvalUrl);
      await sut.app.get(OutboxService).flush();
      const before = tableDigests(sut.app);
      expect((await page(token).expect(410)).body.message).toBe(
        'This request was already answered: thank you',
      );
      await answer(token, {
        answers: [
          { findingId: first.id, answer: 'declined' },
          { findingId: second.id, answer: 'approved' },
        ],
        signedName: 'Someone Else',
      }).expect(410);
      const view = (await page(token).expect(410)).body as { message: string };
      expect(view.message).toMatch(/already answered/);
      expect(tableDigests(sut.app)).toEqual(before);
    });
  });

  describe('what a link cannot reach', () => {
    let mine: FindingDto;
    let other: FindingDto;
    let token: string;

    beforeAll(async () => {
      const day = (await as(dana).get('/api/me/day').expect(200)).body as MyDay;
      const line = day.lines[0]!;
      const ro = db.select().from(jobLines).where(eq(jobLines.id, line.id)).get()!.repairOrderId;
      const elsewhere = db
        .select()
        .from(jobLines)
        .where(and(ne(jobLines.repairOrderId, ro), ne(jobLines.status, 'done')))
        .get()!;
      mine = await quotedFinding(dana, line.id, 'coolant hose soft', {
        customerWording: 'A coolant hose is soft',
        bookHours: 0.5,
      });
      other = await quotedFinding(foreman, elsewhere.id, 'belt cracked', {
        customerWording: 'The drive belt is cracked',
        bookHours: 0.4,
      });
      // The other RO's finding has a link of its own: a link reaches only its own findings.
      await as(advisor).post(`/api/findings/${other.id}/request-approval`).expect(201);
      token = tokenOf(
        (
          (await as(advisor).post(`/api/findings/${mine.id}/request-approval`).expect(201))
            .body as ApprovalRequested
        ).approvalUrl,
      );
    });

    it('never answers for a finding of another RO, nor shows its photos', async () => {
      const view = (await page(token).expect(200)).body as PublicApproval;
      expect(view.findings.map((f) => f.id)).toEqual([mine.id]);
      await sut.app.get(OutboxService).flush();
      const before = tableDigests(sut.app);
      const refused = await answer(token, {
        answers: [{ findingId: other.id, answer: 'approved' }],
        signedName: 'Harriet Quenby',
      }).expect(404);
      const unknown = await answer(token, {
        answers: [{ findingId: 987_654, answer: 'approved' }],
        signedName: 'Harriet Quenby',
      }).expect(404);
      // The same words whether the finding exists or not.
      expect(refused.body.message).toBe(unknown.body.message);
      await answer(token, {
        answers: [
          { findingId: mine.id, answer: 'approved' },
          { findingId: other.id, answer: 'declined' },
        ],
        signedName: 'Harriet Quenby',
      }).expect(404);
      await sut.http().get(`/api/public/approvals/${token}/photos/${other.photos[0]!.id}`).expect(404);
      await sut
        .http()
        .get(`/api/public/approvals/${token}/photos/${other.photos[0]!.id}/preview`)
        .expect(404);
      expect(tableDigests(sut.app)).toEqual(before);
      expect(db.select().from(findings).where(eq(findings.id, other.id)).get()!.answer).toBe('pending');
    });

    it('answers 404 for a token that was never issued, well-formed or not', async () => {
      await page('B'.repeat(43)).expect(404);
      await page('not-a-token').expect(404);
      await answer('B'.repeat(43), {
        answers: [{ findingId: mine.id, answer: 'approved' }],
        signedName: 'X Y',
      }).expect(404);
    });

    it('answers 410 for an expired link', async () => {
      const row = db
        .select()
        .from(approvalLinks)
        .where(eq(approvalLinks.tokenHash, hashApprovalToken(token)))
        .get()!;
      db.update(approvalLinks)
        .set({ expiresAt: new Date(Date.now() - 1000) })
        .where(eq(approvalLinks.id, row.id))
        .run();
      expect((await page(token).expect(410)).body.message).toBe(
        'This link has expired: call the shop for a new one',
      );
      await answer(token, {
        answers: [{ findingId: mine.id, answer: 'approved' }],
        signedName: 'X Y',
      }).expect(410);
      db.update(approvalLinks).set({ expiresAt: row.expiresAt }).where(eq(approvalLinks.id, row.id)).run();
      await page(token).expect(200);
    });

    it('answers 410 once the advisor withdrew the link, or sent a newer one', async () => {
      const again = (await as(advisor).post(`/api/findings/${mine.id}/request-approval`).expect(201))
        .body as ApprovalRequested;
      expect((await page(token).expect(410)).body.message).toBe(
        'The shop withdrew this link: call them for a new one',
      );
      const newer = tokenOf(again.approvalUrl);
      await page(newer).expect(200);
      const revoked = await as(advisor).post(`/api/approval-links/${again.link.id}/revoke`).expect(201);
      expect(revoked.body).toMatchObject({ id: again.link.id, status: 'revoked' });
      await page(newer).expect(410);
      await answer(newer, {
        answers: [{ findingId: mine.id, answer: 'approved' }],
        signedName: 'X Y',
      }).expect(410);
      await as(dana).post(`/api/approval-links/${again.link.id}/revoke`).expect(403);
    });

    it('answers 410 once the shop recorded the answer given by phone', async () => {
      const again = (await as(advisor).post(`/api/findings/${mine.id}/request-approval`).expect(201))
        .body as ApprovalRequested;
      await as(advisor)
        .post(`/api/findings/${mine.id}/answer`, { answer: 'declined', channel: 'phone' })
        .expect(200);
      await page(tokenOf(again.approvalUrl)).expect(410);
    });
  });

  it('withdraws the RO’s open links at pick-up: the page answers 410 and a decline is refused', async () => {
    const ro = (
      await as(advisor)
        .post('/api/repair-orders', {
          customer: { name: 'Ottilie Brandvold', email: 'ottilie@example.test' },
          vehicle: {
            vin: makeVin('5KT5MR7BLM907003'),
            year: 2020,
            make: 'Halvard',
            model: 'Morrow',
            odometer: 64_300,
          },
          concern: 'Squeak over bumps',
          lines: [{ title: 'Inspect front suspension', bookHours: 0.8 }],
        })
        .expect(201)
    ).body as RepairOrderSummary;
    const line = ro.lines[0]!;
    const noted = (
      await sut
        .http()
        .post(`/api/job-lines/${line.id}/findings`)
        .auth(foreman, { type: 'bearer' })
        .field('note', 'sway bar links worn')
        .field('severity', 'soon')
        .expect(201)
    ).body as FindingDto;
    await as(advisor)
      .patch(`/api/findings/${noted.id}/quote`, {
        customerWording: 'The sway bar links are worn',
        bookHours: 0.6,
      })
      .expect(200);
    const sent = (await as(advisor).post(`/api/findings/${noted.id}/request-approval`).expect(201))
      .body as ApprovalRequested;
    const token = tokenOf(sent.approvalUrl);
    await page(token).expect(200);
    await as(foreman).patch(`/api/job-lines/${line.id}`, { status: 'done' }).expect(200);

    await as(advisor).post(`/api/repair-orders/${ro.id}/close`).expect(200);
    expect((await page(token).expect(410)).body.message).toBe(
      'This visit is over and the vehicle picked up: call the shop about this work',
    );
    await answer(token, {
      answers: [{ findingId: noted.id, answer: 'declined' }],
      signedName: 'Ottilie Brandvold',
    }).expect(410);
    const inbox = (await as(advisor).get(`/api/findings?repairOrderId=${ro.id}`).expect(200)).body
      .items as FindingDto[];
    expect(inbox).toMatchObject([
      { id: noted.id, answer: 'pending', approvalLink: { id: sent.link.id, status: 'revoked' } },
    ]);
  });

  describe('guessing', () => {
    let guessing: TestApp;
    afterAll(() => guessing.close());

    it('stops an address after a few wrong links, even for a right one', async () => {
      guessing = await startTestApp();
      const gAdvisor = await guessing.signIn(DEMO.advisor);
      const gDana = (await guessing.badge('1041')).accessToken;
      const day = (await guessing.http().get('/api/me/day').auth(gDana, { type: 'bearer' }).expect(200))
        .body as MyDay;
      const created = (
        await guessing
          .http()
          .post(`/api/job-lines/${day.lines[0]!.id}/findings`)
          .auth(gDana, { type: 'bearer' })
          .field('note', 'tyre worn')
          .field('severity', 'watch')
          .expect(201)
      ).body as FindingDto;
      await guessing
        .http()
        .patch(`/api/findings/${created.id}/quote`)
        .auth(gAdvisor, { type: 'bearer' })
        .send({ customerWording: 'A front tyre is worn', bookHours: 0.3 })
        .expect(200);
      const sent = (
        await guessing
          .http()
          .post(`/api/findings/${created.id}/request-approval`)
          .auth(gAdvisor, { type: 'bearer' })
          .expect(201)
      ).body as ApprovalRequested;

      for (let i = 0; i < APPROVAL_MISSES_ALLOWED; i++)
        await guessing
          .http()
          .get(`/api/public/approvals/${String(i).padStart(43, 'x')}`)
          .expect(404);
      const refused = await guessing
        .http()
        .get(`/api/public/approvals/${'y'.repeat(43)}`)
        .expect(429);
      expect(refused.headers['retry-after']).toMatch(/^\d+$/);
      await guessing
        .http()
        .get(`/api/public/approvals/${tokenOf(sent.approvalUrl)}`)
        .expect(429);
    });
  });
});
