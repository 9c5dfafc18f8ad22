import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeVin, type MyDay } from '@baytime/shared';
import { tableDigests } from '../test-support/table-digests.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { validationPipe } from './validation.js';

interface Answer {
  status: number;
  body: { issues?: { path: (string | number)[]; message: string }[] };
}

describe(validationPipe.name, () => {
  let sut: TestApp;
  let owner: string;
  let lineId: number;
  let technicianId: number;
  const send = (method: 'post' | 'patch', path: string, body: object) =>
    sut.http()[method](path).auth(owner, { type: 'bearer' }).send(body);
  const firstIssue = ({ status, body }: Answer) => ({ status, issue: body.issues?.[0] });

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    const dana = await sut.badge('1041');
    technicianId = dana.user.id;
    lineId = (
      (await sut.http().get('/api/me/day').auth(dana.accessToken, { type: 'bearer' }).expect(200))
        .body as MyDay
    ).lines[0]!.id;
  });
  afterAll(() => sut.close());

  it('refuses control characters, hidden direction marks and empty-looking names: 400, nothing saved', async () => {
    const before = tableDigests(sut.app);
    const user = { role: 'technician', badge: '2201', pin: '4321' };
    const answers = [
      await send('post', '/api/users', { ...user, name: '\u200B\u200D' }),
      await send('post', '/api/users', { ...user, name: 'Ada\u202Eenihwen' }),
      await send('post', '/api/bays', { name: 'Bay\u0000 9' }),
      await send('post', '/api/bays', { name: '\u3164' }),
      await send('patch', '/api/shop', { name: 'Marlow\u2066Creek' }),
    ].map(firstIssue);
    expect(answers).toEqual([
      { status: 400, issue: { path: ['name'], message: 'Enter a name' } },
      { status: 400, issue: { path: ['name'], message: 'Remove the hidden text-direction characters' } },
      { status: 400, issue: { path: ['name'], message: 'Keep it on one line, without control characters' } },
      { status: 400, issue: { path: ['name'], message: 'Name the bay' } },
      { status: 400, issue: { path: ['name'], message: 'Remove the hidden text-direction characters' } },
    ]);
    expect(tableDigests(sut.app)).toEqual(before);
  });

  it('refuses dates before 2000 or over two years ahead, and odometers past 2,000,000', async () => {
    const before = tableDigests(sut.app);
    const farAhead = new Date(Date.now() + 3 * 365 * 86_400_000).toISOString();
    const order = {
      customer: { name: 'Wendell Farrow' },
      vehicle: {
        vin: makeVin('1M8GDM9AKP042788'),
        year: 2019,
        make: 'Halvard',
        model: 'Morrow',
        odometer: 61_200,
      },
      concern: 'Shudder when pulling away',
      lines: [{ title: 'Road test', bookHours: 0.5 }],
    };
    const answers = [
      await send('post', '/api/timecards/corrections', {
        technicianId,
        kind: 'shift-in',
        at: '1999-12-31T08:00:00-06:00',
        reason: 'Forgot to punch in',
      }),
      await send('patch', `/api/job-lines/${lineId}`, { completedAt: '1970-01-01T00:00:00Z' }),
      await send('post', '/api/repair-orders', { ...order, promisedAt: farAhead }),
      await send('post', '/api/repair-orders', {
        ...order,
        vehicle: { ...order.vehicle, odometer: 99_999_999 },
      }),
      await send('post', '/api/repair-orders', {
        ...order,
        lines: [{ title: 'Road test', bookHours: 1e-300 }],
      }),
    ].map(firstIssue);
    expect(answers).toEqual([
      { status: 400, issue: { path: ['at'], message: 'Use a date in 2000 or later' } },
      { status: 400, issue: { path: ['completedAt'], message: 'Use a date in 2000 or later' } },
      { status: 400, issue: { path: ['promisedAt'], message: 'Use a date less than two years ahead' } },
      {
        status: 400,
        issue: {
          path: ['vehicle', 'odometer'],
          message: 'More than 2,000,000 on the odometer: check the reading',
        },
      },
      { status: 400, issue: { path: ['lines', 0, 'bookHours'], message: 'Book hours is at least 0.1' } },
    ]);
    expect(tableDigests(sut.app)).toEqual(before);
  });

  it('reads a multipart number only in plain decimal: "0x10" is not 16 hours', async () => {
    const before = tableDigests(sut.app);
    const { status, body } = await sut
      .http()
      .post(`/api/job-lines/${lineId}/findings`)
      .auth(owner, { type: 'bearer' })
      .field('note', 'Worn drive belt')
      .field('severity', 'soon')
      .field('suggestedHours', '0x10');
    expect(firstIssue({ status, body })).toEqual({
      status: 400,
      issue: { path: ['suggestedHours'], message: 'Suggested hours is a number of hours, like 1.5' },
    });
    expect(tableDigests(sut.app)).toEqual(before);
  });
});
