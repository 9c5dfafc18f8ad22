import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { and, eq } from 'drizzle-orm';
import type {
  BoardSnapshot,
  FindingAnswerResult,
  FindingDto,
  MyDay,
  RepairOrderSummary,
  SignInAnswer,
} from '@baytime/shared';
import { DB, type Db } from '../db/database.js';
import { auditLog } from '../db/schema/index.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';

describe('Findings answered again, and the ready notice from the RO page', () => {
  let sut: TestApp;
  let advisor: string;
  let foreman: string;
  let dana: SignInAnswer;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  const roAudits = (roId: number) =>
    sut.app
      .get<Db>(DB)
      .select()
      .from(auditLog)
      .where(and(eq(auditLog.entity, 'repair-order'), eq(auditLog.entityId, String(roId))))
      .all();
  const finding = async (note: string) => {
    const line = ((await as(dana.accessToken).get('/api/me/day').expect(200)).body as MyDay).lines[0]!;
    return (
      await sut
        .http()
        .post(`/api/job-lines/${line.id}/findings`)
        .auth(dana.accessToken, { type: 'bearer' })
        .field('note', note)
        .field('severity', 'soon')
        .expect(201)
    ).body as FindingDto;
  };

  beforeAll(async () => {
    sut = await startTestApp();
    advisor = await sut.signIn(DEMO.advisor);
    foreman = await sut.signIn(DEMO.foreman);
    dana = await sut.badge('1041');
  });
  afterAll(() => sut.close());

  it('changes a no to a yes with a reason: the line is added and the change audited', async () => {
    const found = await finding('Cracked air filter housing');
    await as(advisor)
      .post(`/api/findings/${found.id}/answer`, { answer: 'declined', channel: 'phone' })
      .expect(200);
    await as(advisor)
      .patch(`/api/findings/${found.id}/answer`, { answer: 'approved', channel: 'phone', bookHours: 0.4 })
      .expect(400);
    const { body } = await as(advisor)
      .patch(`/api/findings/${found.id}/answer`, {
        answer: 'approved',
        channel: 'phone',
        bookHours: 0.4,
        reason: 'Customer called back: do it',
      })
      .expect(200);
    const result = body as FindingAnswerResult;
    expect(result.finding.answer).toBe('approved');
    expect(result.createdLine).toMatchObject({ title: 'Cracked air filter housing', status: 'queued' });
    expect(roAudits(found.repairOrderId).find((a) => a.action === 'finding-answer-changed')!.detail).toEqual({
      findingId: found.id,
      from: 'declined',
      answer: 'approved',
      reason: 'Customer called back: do it',
    });
    await as(dana.accessToken)
      .patch(`/api/findings/${found.id}/answer`, { answer: 'declined', channel: 'phone', reason: 'Because' })
      .expect(403);
  });

  it('changes a yes to a no: the added line is cancelled; once it is done the yes stays (409)', async () => {
    const found = await finding('Wiper blades split');
    const approved = (
      await as(advisor)
        .post(`/api/findings/${found.id}/answer`, { answer: 'approved', channel: 'phone', bookHours: 0.2 })
        .expect(200)
    ).body as FindingAnswerResult;
    const changed = (
      await as(advisor)
        .patch(`/api/findings/${found.id}/answer`, {
          answer: 'declined',
          channel: 'phone',
          reason: 'Customer will fit their own',
        })
        .expect(200)
    ).body as FindingAnswerResult;
    expect(changed.finding).toMatchObject({
      answer: 'declined',
      answerChannel: 'phone',
      createdLineId: null,
    });
    const ro = (await as(advisor).get(`/api/repair-orders/${found.repairOrderId}`).expect(200))
      .body as RepairOrderSummary;
    expect(ro.lines.find((line) => line.id === approved.createdLine!.id)).toMatchObject({
      status: 'cancelled',
      cancelReason: "Customer's answer changed: Customer will fit their own",
    });

    const again = (
      await as(advisor)
        .patch(`/api/findings/${found.id}/answer`, {
          answer: 'approved',
          channel: 'phone',
          bookHours: 0.2,
          reason: 'Changed again',
        })
        .expect(200)
    ).body as FindingAnswerResult;
    await as(foreman).patch(`/api/job-lines/${again.createdLine!.id}`, { status: 'done' }).expect(200);
    await as(advisor)
      .patch(`/api/findings/${found.id}/answer`, { answer: 'declined', channel: 'phone', reason: 'Too late' })
      .expect(409);
  });

  it('sends the ready notice only once the work is done, and never after pick-up (bug 4)', async () => {
    const board = (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
    const working = board.bays.find((b) => b.state === 'working')!.repairOrder!;
    const refused = await as(advisor).post(`/api/repair-orders/${working.id}/ready-notice`).expect(409);
    expect(refused.body.message).toMatch(/^The work on RO \d+ is not done yet \(\d+ of \d+ lines open\)$/);
    const ready = board.bays.find((b) => b.state === 'ready')!.repairOrder!;
    const sent = await as(foreman).post(`/api/repair-orders/${ready.id}/ready-notice`).expect(202);
    expect(
      roAudits(ready.id)
        .filter((a) => a.action === 'ready-notice')
        .map((a) => a.detail),
    ).toEqual([
      {
        mailId: sent.body.mail.mailId,
        textId: sent.body.text.textId,
        to: sent.body.mail.to,
        mobile: sent.body.text.to,
      },
    ]);
    await as(advisor).post(`/api/repair-orders/${ready.id}/close`).expect(200);
    await as(advisor).post(`/api/repair-orders/${ready.id}/ready-notice`).expect(409);
  });
});
