import { randomUUID } from 'node:crypto';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { MyDay, SignInAnswer } from '@baytime/shared';
import { tableDigests } from '../test-support/table-digests.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { referencedOrFail } from './not-found.js';

/** An id that names no row in the demo shop. */
const NOBODY = 999_999;

describe(referencedOrFail.name, () => {
  let sut: TestApp;
  let foreman: string;
  let dana: SignInAnswer;
  let line: MyDay['lines'][number];
  const send = (method: 'post' | 'patch', path: string, body: object, token = foreman) =>
    sut.http()[method](path).auth(token, { type: 'bearer' }).send(body);

  beforeAll(async () => {
    sut = await startTestApp();
    foreman = await sut.signIn(DEMO.foreman);
    dana = await sut.badge('1041');
    const day = (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' }).expect(200))
      .body as MyDay;
    line = day.lines[0]!;
  });
  afterAll(() => sut.close());

  it('answers 400 for an id in a body that names nothing, and changes nothing', async () => {
    const before = tableDigests(sut.app);
    const hold = { kind: 'set-time', durationSeconds: 600 };
    const refusals: [string, Promise<{ status: number; body: { message: string } }>][] = [
      // A foreign-key error used to answer 500 here.
      [
        'No active bay with that id',
        send('post', '/api/timers', { ...hold, jobLineId: line.id, bayId: NOBODY }, dana.accessToken),
      ],
      [
        'No job line with that id',
        send('post', '/api/timers', { ...hold, jobLineId: NOBODY }, dana.accessToken),
      ],
      ['No active bay with that id', send('patch', `/api/job-lines/${line.id}`, { bayId: NOBODY })],
      [
        'No active technician with that id',
        send('patch', `/api/job-lines/${line.id}`, { technicianId: NOBODY }),
      ],
      [
        'That job line does not exist',
        send(
          'post',
          '/api/punches',
          { id: randomUUID(), kind: 'job-on', jobLineId: NOBODY },
          dana.accessToken,
        ),
      ],
      [
        'No active technician with that id',
        send('post', '/api/punches', { id: randomUUID(), kind: 'shift-in', technicianId: NOBODY }),
      ],
    ];
    const at = new Date(Date.now() - 3600_000).toISOString();
    const correction = { technicianId: dana.user.id, kind: 'shift-in', at, reason: 'Forgot to punch' };
    refusals.push(
      [
        'No technician with that id',
        send('post', '/api/timecards/corrections', { ...correction, technicianId: NOBODY }),
      ],
      [
        'No punch with that id',
        send('post', '/api/timecards/corrections', { ...correction, punchId: randomUUID() }),
      ],
      [
        'No job line with that id',
        send('post', '/api/timecards/corrections', { ...correction, kind: 'job-on', jobLineId: NOBODY }),
      ],
    );
    for (const [message, answer] of refusals) {
      const { status, body } = await answer;
      expect({ status, message: body.message }).toEqual({ status: 400, message });
    }
    expect(tableDigests(sut.app)).toEqual(before);
  });

  it('answers 404 for an unknown id in the path', async () => {
    const before = tableDigests(sut.app);
    await send('patch', `/api/job-lines/${NOBODY}`, { priority: 'high' }).expect(404);
    await send('post', `/api/job-lines/${NOBODY}/hold`, { reason: 'parts' }).expect(404);
    await send('post', `/api/timers/${NOBODY}/stop`, {}).expect(404);
    await send('post', `/api/timers/${NOBODY}/readings`, { tempC: 40 }).expect(404);
    await send('post', `/api/findings/${NOBODY}/answer`, { answer: 'declined', channel: 'phone' }).expect(
      404,
    );
    expect(tableDigests(sut.app)).toEqual(before);
  });
});
