import { randomUUID } from 'node:crypto';
import { afterAll, afterEach, beforeAll, describe, expect, it, vi } from 'vitest';
import type { MyDay, SignInAnswer } from '@baytime/shared';
import { AuditService } from '../audit/audit.service.js';
import { BoardService } from '../board/board.service.js';
import { FloorService } from '../floor/floor.service.js';
import { LiveService, type LiveMessage } from '../live/live.service.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { SQLITE, type Sqlite } from './database.js';
import { UnitOfWork } from './unit-of-work.js';

const TABLES = ['punches', 'job_lines', 'bays', 'repair_orders', 'findings', 'audit_log'] as const;

describe(UnitOfWork.name, () => {
  let sut: TestApp;
  let foreman: string;
  let messages: LiveMessage[];

  const as = (token: string) => ({
    get: (path: string) => sut.http().get(path).auth(token, { type: 'bearer' }),
    post: (path: string, body: object = {}) =>
      sut.http().post(path).auth(token, { type: 'bearer' }).send(body),
  });
  const day = async (tech: SignInAnswer) =>
    (await as(tech.accessToken).get('/api/me/day').expect(200)).body as MyDay;

  /** Every row of the tables a command can touch, and what the floor model shows. */
  function everything() {
    const { connection } = sut.app.get<Sqlite>(SQLITE);
    const rows = Object.fromEntries(
      TABLES.map((table) => [table, connection.prepare(`select * from ${table} order by rowid`).all()]),
    );
    const now = new Date('2026-12-02T12:00:00Z');
    return { rows, floor: sut.app.get(BoardService).snapshot(0, now) };
  }

  beforeAll(async () => {
    sut = await startTestApp();
    foreman = await sut.signIn(DEMO.foreman);
    messages = [];
    sut.app.get(LiveService).messages$.subscribe((message) => messages.push(message));
  });
  afterEach(() => vi.restoreAllMocks());
  afterAll(() => sut.close());

  it('keeps nothing of a finished line when its audit row fails: punches, line, bay, RO and the floor', async () => {
    const luis = await sut.badge('1042');
    const line = (await day(luis)).lines.find((l) => l.clockedOn)!;
    const before = everything();
    messages.length = 0;
    vi.spyOn(sut.app.get(AuditService), 'record').mockImplementation(() => {
      throw new Error('disk full');
    });

    const done = { next: 'ready', cause: 'Worn and out of spec', correction: 'Replaced and road tested' };
    await as(luis.accessToken).post(`/api/job-lines/${line.id}/done`, done).expect(500);

    expect(everything()).toEqual(before);
    expect(messages).toEqual([]);
    vi.restoreAllMocks();
    // The same command then works, and is published once.
    await as(luis.accessToken).post(`/api/job-lines/${line.id}/done`, done).expect(200);
    expect(messages.map((m) => m.event)).toContain('job-line.updated');
  });

  it('keeps no punch when the line it starts cannot be updated', async () => {
    const sam = await sut.badge('1046');
    const queued = (await day(sam)).lines.find((l) => l.status === 'queued' && !l.clockedOn);
    const lineId = queued?.id ?? (await as(foreman).get('/api/board').expect(200)).body.queue[0].jobLineId;
    await as(sam.accessToken).post('/api/punches', { id: randomUUID(), kind: 'shift-in' });
    const before = everything();
    messages.length = 0;
    vi.spyOn(sut.app.get(FloorService), 'linesChanged').mockImplementation(() => {
      throw new Error('lost the line');
    });

    await as(foreman)
      .post('/api/punches', {
        id: randomUUID(),
        kind: 'job-on',
        jobLineId: lineId,
        technicianId: sam.user.id,
      })
      .expect(500);

    expect(everything()).toEqual(before);
    expect(messages).toEqual([]);
  });

  it('keeps no new line when an approved finding cannot be audited', async () => {
    const dana = await sut.badge('1041');
    const line = (await day(dana)).lines[0]!;
    const created = await sut
      .http()
      .post(`/api/job-lines/${line.id}/findings`)
      .auth(dana.accessToken, { type: 'bearer' })
      .field('note', 'Rear brake hose cracked')
      .field('severity', 'soon')
      .expect(201);
    const findingId = (created.body as { id: number }).id;
    const before = everything();
    messages.length = 0;
    vi.spyOn(sut.app.get(AuditService), 'record').mockImplementation(() => {
      throw new Error('disk full');
    });

    await as(foreman)
      .post(`/api/findings/${findingId}/answer`, { answer: 'approved', channel: 'phone', bookHours: 1.2 })
      .expect(500);

    expect(everything()).toEqual(before);
    expect(messages).toEqual([]);
  });
});
