import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardSnapshot, MyDay, SignInAnswer } from '@baytime/shared';
import { DEMO_CONCERNS } from '../demo/demo-shop.js';
import { tableDigests } from '../test-support/table-digests.js';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { JobLinesService } from './job-lines.service.js';

describe(JobLinesService.name, () => {
  let sut: TestApp;
  let foreman: string;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  const board = async () => (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
  const day = async (tech: SignInAnswer) =>
    (await as(tech.accessToken).get('/api/me/day').expect(200)).body as MyDay;
  const words = { cause: 'Worn and out of spec', correction: 'Replaced and road tested' };

  beforeAll(async () => {
    sut = await startTestApp();
    foreman = await sut.signIn(DEMO.foreman);
  });
  afterAll(() => sut.close());

  it('holds a line with a reason: the tech is clocked off and the bay shows held', async () => {
    const dana = await sut.badge('1041');
    const line = (await day(dana)).lines.find((l) => l.clockedOn)!;
    const { body } = await as(dana.accessToken)
      .post(`/api/job-lines/${line.id}/hold`, { reason: 'approval' })
      .expect(200);
    expect(body).toMatchObject({ status: 'held', holdReason: 'approval' });
    expect((await day(dana)).openJobLineIds).toEqual([]);
    const bay = (await board()).bays.find((b) => b.jobLine?.id === line.id)!;
    expect(bay).toMatchObject({ state: 'held', holdReason: 'approval', clockRunning: false });
    await as(dana.accessToken).post(`/api/job-lines/${line.id}/hold`, { reason: 'later' }).expect(400);
  });

  it('marks a line done: the bay goes to check, or ready when asked', async () => {
    const luis = await sut.badge('1042');
    const line = (await day(luis)).lines.find((l) => l.clockedOn)!;
    await as(luis.accessToken)
      .post(`/api/job-lines/${line.id}/done`, { next: 'ready', ...words })
      .expect(200);
    const bay = (await board()).bays.find((b) => b.name === line.bayName)!;
    expect(bay.state).toBe('ready');
    expect((await day(luis)).lines.map((l) => l.id)).not.toContain(line.id);
  });

  it('Done records cause and correction and who finished, and the kiosk counts it as done today (bug 9)', async () => {
    const sam = await sut.badge('1046');
    const before = await day(sam);
    const line = before.lines[0]!;
    expect(line.concern).toBe(DEMO_CONCERNS[line.title]);
    const { body } = await as(sam.accessToken)
      .post(`/api/job-lines/${line.id}/done`, {
        next: 'check',
        cause: 'Seal weeping at the pan',
        correction: 'Resealed the pan and let it cure',
      })
      .expect(200);
    expect(body).toMatchObject({
      status: 'done',
      completedBy: sam.user.id,
      cause: 'Seal weeping at the pan',
      correction: 'Resealed the pan and let it cure',
    });
    expect((await day(sam)).doneToday).toBe(before.doneToday + 1);
  });

  it("refuses a technician acting on someone else's line", async () => {
    const sam = await sut.badge('1046');
    const notSams = (await board()).bays.find(
      (b) => b.jobLine && !b.technicians.some((t) => t.id === sam.user.id),
    )!.jobLine!;
    await as(sam.accessToken).post(`/api/job-lines/${notSams.id}/done`, words).expect(403);
  });

  it('assigns a queued line to a tech and bay: the bay is staged and the kiosk hears it at once', async () => {
    const jo = await sut.badge('1045');
    const kiosk = sut.connect(jo.accessToken);
    await nextEvent(kiosk, 'board.snapshot');
    const queued = (await board()).queue[0]!;
    const free = (await board()).bays.find((b) => b.state === 'free')!;
    const heard = nextEvent(kiosk, 'job-line.updated', ({ jobLine }) => jobLine.id === queued.jobLineId);
    await as(foreman)
      .patch(`/api/job-lines/${queued.jobLineId}`, { technicianId: jo.user.id, bayId: free.id })
      .expect(200);
    expect((await heard).jobLine.technicianId).toBe(jo.user.id);
    expect((await board()).bays.find((b) => b.id === free.id)).toMatchObject({
      state: 'staged',
      jobLine: { id: queued.jobLineId },
    });
    expect((await day(jo)).lines.map((l) => l.id)).toContain(queued.jobLineId);
  });

  it('reassigning a line someone is clocked on clocks them off with an audited reason', async () => {
    const priya = await sut.badge('1043');
    const marcus = await sut.badge('1044');
    await as(priya.accessToken).post('/api/punches', { id: randomUUID(), kind: 'break-end' }).expect(201);
    const line = (await day(marcus)).lines[0]!;
    // Helping on Marcus's line is the foreman's call: the foreman clocks Priya on.
    await as(foreman)
      .post('/api/punches', {
        id: randomUUID(),
        kind: 'job-on',
        jobLineId: line.id,
        technicianId: priya.user.id,
      })
      .expect(201);
    await as(foreman).patch(`/api/job-lines/${line.id}`, { technicianId: priya.user.id }).expect(200);
    expect((await day(priya)).openJobLineIds).toEqual([]);
    const card = (await as(foreman).get(`/api/timecards?technicianId=${priya.user.id}`).expect(200)).body;
    expect(card.punches.at(-1)).toMatchObject({ kind: 'job-off', reason: 'Line reassigned by the foreman' });
  });

  it("refuses a technician's Done without the cause and correction, as the kiosk does; the foreman needs none", async () => {
    const jo = await sut.badge('1045');
    const [mine, foremans] = (await board()).queue;
    await as(foreman).patch(`/api/job-lines/${mine!.jobLineId}`, { technicianId: jo.user.id }).expect(200);
    const done = (token: string, id: number, body: object) =>
      as(token).post(`/api/job-lines/${id}/done`, body);

    const before = tableDigests(sut.app);
    for (const body of [{ next: 'check' }, { next: 'check', cause: '  ', correction: 'ok' }]) {
      const refused = await done(jo.accessToken, mine!.jobLineId, body).expect(400);
      expect(refused.body).toEqual({
        statusCode: 400,
        message: 'Say what you found; Say what you did',
        issues: [
          { path: ['cause'], message: 'Say what you found' },
          { path: ['correction'], message: 'Say what you did' },
        ],
      });
    }
    expect(tableDigests(sut.app)).toEqual(before);
    expect((await day(jo)).lines.find((l) => l.id === mine!.jobLineId)).toMatchObject({ status: 'queued' });

    const finished = await done(jo.accessToken, mine!.jobLineId, { next: 'check', ...words }).expect(200);
    expect(finished.body).toMatchObject({ status: 'done', completedBy: jo.user.id, ...words });
    const byForeman = await done(foreman, foremans!.jobLineId, { next: 'check' }).expect(200);
    expect(byForeman.body).toMatchObject({ status: 'done', cause: null, correction: null });
  });
});
