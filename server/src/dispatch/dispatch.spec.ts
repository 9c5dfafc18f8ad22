import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeVin, type BoardSnapshot, type DispatchBoard, type RepairOrderSummary } from '@baytime/shared';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { DispatchService } from './dispatch.service.js';

describe(DispatchService.name, () => {
  let sut: TestApp;
  beforeAll(async () => {
    sut = await startTestApp();
  });
  afterAll(() => sut.close());

  it('flags a line that cannot make its promise and counts it on the wall board', async () => {
    const foreman = await sut.signIn(DEMO.foreman);
    const { body: ro } = await sut
      .http()
      .post('/api/repair-orders')
      .auth(foreman, { type: 'bearer' })
      .send({
        customer: { name: 'Odile Marsh' },
        vehicle: {
          vin: makeVin('7AB6LD9HLM900777'),
          year: 2020,
          make: 'Ambrey',
          model: 'Lunda',
          odometer: 5000,
        },
        concern: 'Needed back within the hour',
        promisedAt: new Date(Date.now() + 30 * 60_000).toISOString(),
        lines: [{ title: 'Replace water pump', bookHours: 6 }],
      })
      .expect(201);
    const line = (ro as RepairOrderSummary).lines[0]!;
    const jo = (await sut.badge('1045')).user.id;
    await sut
      .http()
      .patch(`/api/job-lines/${line.id}`)
      .auth(foreman, { type: 'bearer' })
      .send({ technicianId: jo })
      .expect(200);

    const dispatch = (await sut.http().get('/api/dispatch').auth(foreman, { type: 'bearer' }).expect(200))
      .body as DispatchBoard;
    const forecast = dispatch.lanes.flatMap((lane) => lane.lines).find((l) => l.id === line.id)!.forecast;
    expect(forecast?.late).toBe(true);
    await expect
      .poll(
        async () =>
          ((await sut.http().get('/api/board').auth(foreman, { type: 'bearer' })).body as BoardSnapshot)
            .lateLines,
        { timeout: 10_000 },
      )
      .toBe(dispatch.lateCount);
    expect(dispatch.lateCount).toBeGreaterThan(0);
  });
});
