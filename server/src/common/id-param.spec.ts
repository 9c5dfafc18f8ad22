import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardSnapshot } from '@baytime/shared';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';

describe('idParamSchema', () => {
  let sut: TestApp;
  let foreman: string;
  const get = (path: string) => sut.http().get(path).auth(foreman, { type: 'bearer' });

  beforeAll(async () => {
    sut = await startTestApp();
    foreman = await sut.signIn(DEMO.foreman);
  });
  afterAll(() => sut.close());

  it('reads ids in paths and queries as decimal digits only: "0x10" is not 16', async () => {
    const ro = ((await get('/api/board').expect(200)).body as BoardSnapshot).bays.find(
      (b) => b.repairOrder,
    )!.repairOrder!;
    await get(`/api/repair-orders/${ro.id}`).expect(200);
    const hex = `0x${ro.id.toString(16)}`;
    const refused = await get(`/api/repair-orders/${hex}`).expect(400);
    expect(refused.body.issues).toEqual([{ path: [], message: 'An id is a positive whole number' }]);
    for (const spelling of [`${ro.id}e0`, `0b${ro.id.toString(2)}`, 'Infinity', '9007199254740993'])
      await get(`/api/repair-orders/${spelling}`).expect(400);

    const tech = (await sut.badge('1041')).user.id;
    await get(`/api/timecards?technicianId=${tech}`).expect(200);
    await get(`/api/timecards?technicianId=0x${tech.toString(16)}`).expect(400);
    await get(`/api/findings?repairOrderId=0x${ro.id.toString(16)}`).expect(400);
  });
});
