import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardSnapshot, DispatchBoard, MyDay, SignInAnswer } from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { PartsService } from './parts.service.js';

describe(PartsService.name, () => {
  let sut: TestApp;
  let foreman: string;
  let advisor: string;
  let dana: SignInAnswer;
  let lineId: number;
  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
    put: (path: string, body: object) => sut.http().put(path).auth(token, { type: 'bearer' }).send(body),
  });
  const board = async () => (await as(foreman).get('/api/board').expect(200)).body as BoardSnapshot;
  const dispatch = async () => (await as(foreman).get('/api/dispatch').expect(200)).body as DispatchBoard;
  const day = async (tech: SignInAnswer) =>
    (await as(tech.accessToken).get('/api/me/day').expect(200)).body as MyDay;
  const myLine = async () => (await day(dana)).lines.find((l) => l.id === lineId)!;
  const inTwoHours = () => new Date(Date.now() + 2 * 3600_000).toISOString();

  beforeAll(async () => {
    sut = await startTestApp();
    foreman = await sut.signIn(DEMO.foreman);
    advisor = await sut.signIn(DEMO.advisor);
    dana = await sut.badge('1041');
    lineId = (await day(dana)).lines.find((l) => l.clockedOn)!.id;
  });
  afterAll(() => sut.close());

  it('a technician holds a line for parts and names the part; the office records the rest', async () => {
    await as(dana.accessToken)
      .post(`/api/job-lines/${lineId}/hold`, { reason: 'parts', part: 'Left outer tie rod end' })
      .expect(200);
    expect((await myLine()).parts).toEqual({
      part: 'Left outer tie rod end',
      state: null,
      supplier: null,
      expectedAt: null,
      receivedAt: null,
    });
    const expectedAt = inTwoHours();
    const { body } = await as(advisor)
      .put(`/api/job-lines/${lineId}/parts`, {
        part: 'Left outer tie rod end',
        state: 'back-ordered',
        supplier: 'Kestrel Parts Depot',
        expectedAt,
      })
      .expect(200);
    expect(body).toEqual({
      part: 'Left outer tie rod end',
      state: 'back-ordered',
      supplier: 'Kestrel Parts Depot',
      expectedAt,
      receivedAt: null,
    });
    const bay = (await board()).bays.find((b) => b.jobLine?.id === lineId)!;
    expect(bay).toMatchObject({ state: 'held', holdReason: 'parts', partsDueAt: expectedAt });
    const line = (await dispatch()).lanes.flatMap((lane) => lane.lines).find((l) => l.id === lineId)!;
    expect(line.parts).toMatchObject({ supplier: 'Kestrel Parts Depot', expectedAt });
    // The forecast counts the line, starting no earlier than the parts are due.
    expect(new Date(line.forecast!.startAt).getTime()).toBeGreaterThanOrEqual(Date.parse(expectedAt));
  });

  it('refuses bad parts details and a line not held for parts, changing nothing', async () => {
    const before = (await myLine()).parts;
    const bad = await as(foreman)
      .put(`/api/job-lines/${lineId}/parts`, { part: '  ', state: 'lost' })
      .expect(400);
    expect(bad.body.issues.map((i: { path: string[] }) => i.path.join('.'))).toEqual(['part', 'state']);
    await as(foreman).put(`/api/job-lines/${lineId}/parts`, { part: 'x', expectedAt: 'soon' }).expect(400);
    expect((await myLine()).parts).toEqual(before);
    const working = (await dispatch()).lanes.flatMap((lane) => lane.lines).find((l) => l.status !== 'held')!;
    const refused = await as(foreman).put(`/api/job-lines/${working.id}/parts`, { part: 'Hub' }).expect(409);
    expect(refused.body.message).toBe('That line is not held for parts');
    await as(foreman).post(`/api/job-lines/${working.id}/parts/received`).expect(409);
    await as(foreman).put('/api/job-lines/999999/parts', { part: 'Hub' }).expect(404);
  });

  it('a held line without a known arrival has no forecast', async () => {
    const other = (await dispatch()).lanes
      .flatMap((lane) => lane.lines)
      .find((l) => l.status === 'queued' && l.technicianId !== null)!;
    await as(foreman).post(`/api/job-lines/${other.id}/hold`, { reason: 'parts' }).expect(200);
    const held = (await dispatch()).lanes.flatMap((lane) => lane.lines).find((l) => l.id === other.id)!;
    expect(held).toMatchObject({ status: 'held', forecast: null, parts: { part: null, expectedAt: null } });
  });

  it('parts received: the line goes back to its technician, live, and their kiosk says so', async () => {
    const kiosk = sut.connect(dana.accessToken);
    await nextEvent(kiosk, 'board.snapshot');
    const heard = nextEvent(kiosk, 'job-line.updated', ({ jobLine }) => jobLine.id === lineId);
    const { body } = await as(foreman).post(`/api/job-lines/${lineId}/parts/received`).expect(200);
    expect(body).toMatchObject({ status: 'queued', holdReason: null, technicianId: dana.user.id });
    expect((await heard).jobLine).toMatchObject({ status: 'queued', technicianId: dana.user.id });
    const line = await myLine();
    expect(line.status).toBe('queued');
    expect(line.parts).toMatchObject({ part: 'Left outer tie rod end', state: 'back-ordered' });
    expect(Date.parse(line.parts!.receivedAt!)).toBeGreaterThan(Date.now() - 60_000);
    expect((await board()).bays.find((b) => b.jobLine?.id === lineId)?.partsDueAt ?? null).toBeNull();
    await as(foreman).post(`/api/job-lines/${lineId}/parts/received`).expect(409);
  });

  it('only a line held for parts names a part', async () => {
    const refused = await as(dana.accessToken)
      .post(`/api/job-lines/${lineId}/hold`, { reason: 'tooling', part: 'Press' })
      .expect(400);
    expect(refused.body.issues[0]).toMatchObject({
      path: ['part'],
      message: 'Only a line held for parts names a part',
    });
  });
});
