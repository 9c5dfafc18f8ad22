import { randomUUID } from 'node:crypto';
import { readdirSync } from 'node:fs';
import sharp from 'sharp';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardSnapshot, DispatchBoard, MyDay, SignInAnswer, TimerDto } from '@baytime/shared';
import { tableDigests } from '../test-support/table-digests.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { LineAccessService } from './line-access.service.js';

describe(LineAccessService.name, () => {
  let sut: TestApp;
  let foreman: string;
  let owner: string;
  let dana: SignInAnswer;
  let sam: SignInAnswer;
  let luis: SignInAnswer;
  let png: Buffer;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    patch: (path: string, body: object) => sut.http().patch(path).auth(token, { type: 'bearer' }).send(body),
  });
  const day = async (tech: SignInAnswer) =>
    (await as(tech.accessToken).get('/api/me/day').expect(200)).body as MyDay;
  const punch = (tech: SignInAnswer, kind: string, jobLineId: number) =>
    as(tech.accessToken).post('/api/punches', { id: randomUUID(), kind, jobLineId });
  const finding = (tech: SignInAnswer, lineId: number, holdForApproval: boolean) =>
    sut
      .http()
      .post(`/api/job-lines/${lineId}/findings`)
      .auth(tech.accessToken, { type: 'bearer' })
      .field('note', 'Cracked coolant hose')
      .field('severity', 'soon')
      .field('holdForApproval', String(holdForApproval))
      .attach('photos', png, { filename: 'hose.png', contentType: 'image/png' });
  const storedFiles = () => readdirSync(sut.config.uploadsDir, { recursive: true }).sort();
  const dispatch = async () => (await as(foreman).get('/api/dispatch').expect(200)).body as DispatchBoard;

  beforeAll(async () => {
    sut = await startTestApp();
    foreman = await sut.signIn(DEMO.foreman);
    owner = await sut.signIn(DEMO.owner);
    dana = await sut.badge('1041');
    luis = await sut.badge('1042');
    sam = await sut.badge('1046');
    png = await sharp({ create: { width: 32, height: 24, channels: 3, background: '#2c6ea0' } })
      .png()
      .toBuffer();
  });
  afterAll(() => sut.close());

  it('refuses every line and timer command from a technician not on the line: 403, nothing changed', async () => {
    const danas = (await day(dana)).lines.find((line) => line.clockedOn)!;
    const timer = (
      await as(dana.accessToken)
        .post('/api/timers', { jobLineId: danas.id, kind: 'warm-up', targetC: 90, cautionAcknowledged: true })
        .expect(201)
    ).body as TimerDto;
    const held = (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
    const priyasHeld = held.bays.find((bay) => bay.state === 'held')!.jobLine!;
    const marcusCure = held.bays.find(
      (bay) => bay.timer?.kind === 'set-time' && bay.timer.id !== timer.id,
    )!.timer!;

    const before = tableDigests(sut.app);
    const files = storedFiles();
    const refused: [string, () => PromiseLike<{ status: number; body: { message: string } }>][] = [
      ['job-on', () => punch(sam, 'job-on', danas.id)],
      ['job-off', () => punch(sam, 'job-off', danas.id)],
      ['hold', () => as(sam.accessToken).post(`/api/job-lines/${danas.id}/hold`, { reason: 'parts' })],
      ['resume', () => as(sam.accessToken).post(`/api/job-lines/${priyasHeld.id}/resume`)],
      [
        'done',
        () =>
          as(sam.accessToken).post(`/api/job-lines/${danas.id}/done`, {
            next: 'ready',
            cause: 'Pan gasket weeping',
            correction: 'Replaced the pan gasket',
          }),
      ],
      ['finding', () => finding(sam, danas.id, false)],
      ['finding that holds the line', () => finding(sam, danas.id, true)],
      [
        'timer start',
        () =>
          as(sam.accessToken).post('/api/timers', {
            jobLineId: priyasHeld.id,
            kind: 'set-time',
            durationSeconds: 600,
          }),
      ],
      ['timer reading', () => as(sam.accessToken).post(`/api/timers/${timer.id}/readings`, { tempC: 299 })],
      ['timer stop', () => as(sam.accessToken).post(`/api/timers/${timer.id}/stop`)],
      ['another timer stop', () => as(sam.accessToken).post(`/api/timers/${marcusCure.id}/stop`)],
    ];
    const answers: Record<string, string> = {};
    for (const [command, send] of refused) {
      const { status, body } = await send();
      answers[command] = `${status} ${body.message}`;
    }
    expect(answers).toEqual(
      Object.fromEntries(
        refused.map(([command]) => [command, expect.stringMatching(/^403 .*ask the foreman$/)]),
      ),
    );
    expect(tableDigests(sut.app)).toEqual(before);
    expect(storedFiles()).toEqual(files);
  });

  it('lets a helper the foreman clocked on work the line and its timer', async () => {
    const lines = (await day(luis)).lines;
    const luiss = lines.find((line) => line.clockedOn)!;
    const timer = (
      await as(luis.accessToken)
        .post('/api/timers', { jobLineId: luiss.id, kind: 'warm-up', targetC: 90, cautionAcknowledged: true })
        .expect(201)
    ).body as TimerDto;
    await as(sam.accessToken).post(`/api/timers/${timer.id}/readings`, { tempC: 60 }).expect(403);
    await as(foreman)
      .post('/api/punches', {
        id: randomUUID(),
        kind: 'job-on',
        jobLineId: luiss.id,
        technicianId: sam.user.id,
      })
      .expect(201);
    await as(sam.accessToken).post(`/api/timers/${timer.id}/readings`, { tempC: 60 }).expect(200);
    await as(sam.accessToken).post(`/api/timers/${timer.id}/stop`).expect(200);
    await punch(sam, 'job-off', luiss.id).expect(201);
    // Off the line again, the helper is refused once more; the owner may still stop a timer.
    const next = (
      await as(luis.accessToken)
        .post('/api/timers', { jobLineId: luiss.id, kind: 'set-time', durationSeconds: 60 })
        .expect(201)
    ).body as TimerDto;
    await as(sam.accessToken).post(`/api/timers/${next.id}/stop`).expect(403);
    await as(owner).post(`/api/timers/${next.id}/stop`).expect(200);
  });

  it('lets a technician take an unassigned line by clocking on, after which it is theirs alone', async () => {
    const [open] = (await dispatch()).queue;
    await punch(sam, 'job-on', open!.id).expect(201);
    const samsLane = (await dispatch()).lanes.find((lane) => lane.technician.id === sam.user.id)!;
    expect(samsLane.lines.find((l) => l.id === open!.id)).toMatchObject({
      technicianId: sam.user.id,
      status: 'working',
    });
    expect((await day(sam)).openJobLineIds).toEqual([open!.id]);
    const refused = await punch(luis, 'job-on', open!.id).expect(403);
    expect(refused.body.message).toBe('That line is assigned to someone else: ask the foreman');
    await punch(sam, 'job-off', open!.id).expect(201);
  });

  it('leaves unassigned lines to the foreman when the shop says so', async () => {
    await as(owner).patch('/api/shop', { techniciansTakeUnassigned: false }).expect(200);
    const [open] = (await dispatch()).queue;
    const before = tableDigests(sut.app);
    const refused = await punch(sam, 'job-on', open!.id).expect(403);
    expect(refused.body.message).toBe('The foreman assigns unassigned lines here: ask the foreman');
    expect(tableDigests(sut.app)).toEqual(before);
    await as(owner).patch('/api/shop', { techniciansTakeUnassigned: true }).expect(200);
    expect((await as(owner).get('/api/shop').expect(200)).body.techniciansTakeUnassigned).toBe(true);
  });
});
