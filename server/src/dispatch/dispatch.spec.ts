import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeVin, type BoardSnapshot, type DispatchBoard, type RepairOrderSummary } from '@baytime/shared';
import { createApp } from '../app.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { DispatchService, NO_OPENING_HOURS } from './dispatch.service.js';

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

  // Common practice (no published source): a technician's own pace drives forecasts only after enough clocked
  // time; the shop sets how much (8 h by default). Dana has about 75 h in the demo's last four weeks.
  it("uses a technician's own efficiency only after the shop's minimum of clocked hours", async () => {
    const owner = await sut.signIn(DEMO.owner);
    const dana = (await sut.badge('1041')).user.id;
    const laneOf = async () =>
      (
        (await sut.http().get('/api/dispatch').auth(owner, { type: 'bearer' }).expect(200))
          .body as DispatchBoard
      ).lanes.find((lane) => lane.technician.id === dana)!;
    expect((await laneOf()).efficiency).toBeGreaterThan(1);
    await sut
      .http()
      .patch('/api/shop')
      .auth(owner, { type: 'bearer' })
      .send({ minimumClockedHoursForEfficiency: 200 })
      .expect(200);
    try {
      expect((await laneOf()).efficiency).toBeNull();
    } finally {
      await sut
        .http()
        .patch('/api/shop')
        .auth(owner, { type: 'bearer' })
        .send({ minimumClockedHoursForEfficiency: 8 })
        .expect(200);
    }
  });

  describe('opening hours that once stopped the server', () => {
    const closedEveryDay = Array(7).fill(null);
    const nights = Array.from({ length: 7 }, () => ({ open: '22:00', close: '06:00' }));
    const roundTheClock = Array.from({ length: 7 }, () => ({ open: '08:00', close: '08:00' }));

    async function saveHours(token: string, openingHours: unknown): Promise<DispatchBoard> {
      await sut.http().patch('/api/shop').auth(token, { type: 'bearer' }).send({ openingHours }).expect(200);
      // Past the late-count debounce, where the old crash happened in the background.
      await new Promise((resolve) => setTimeout(resolve, 1800));
      await sut.http().get('/api/health').expect(200);
      return (await sut.http().get('/api/dispatch').auth(token, { type: 'bearer' }).expect(200))
        .body as DispatchBoard;
    }

    it('forecasts through the night in a night shop and round the clock', async () => {
      const owner = await sut.signIn(DEMO.owner);
      for (const openingHours of [nights, roundTheClock]) {
        const dispatch = await saveHours(owner, openingHours);
        expect(dispatch.forecastNote).toBeNull();
        const forecasts = dispatch.lanes
          .flatMap((lane) => lane.lines)
          .filter((line) => line.status !== 'held');
        expect(forecasts.length).toBeGreaterThan(0);
        for (const { forecast } of forecasts)
          expect(Date.parse(forecast!.finishAt)).toBeGreaterThanOrEqual(Date.parse(dispatch.serverTime));
      }
    });

    it('says there are no forecasts when every day is closed, and keeps serving across a restart', async () => {
      const owner = await sut.signIn(DEMO.owner);
      const dispatch = await saveHours(owner, closedEveryDay);
      expect(dispatch.forecastNote).toBe(NO_OPENING_HOURS);
      const assigned = dispatch.lanes.flatMap((lane) => lane.lines);
      expect(assigned.length).toBeGreaterThan(0);
      expect(assigned.every((line) => line.forecast === null)).toBe(true);

      // The same database file served again: it used to die at start-up.
      await sut.app.close();
      sut.app = await createApp(sut.config, false);
      await sut.app.listen(0, '127.0.0.1');
      await sut.http().get('/api/health').expect(200);
      const again = await sut.http().get('/api/dispatch').auth(owner, { type: 'bearer' }).expect(200);
      expect((again.body as DispatchBoard).forecastNote).toBe(NO_OPENING_HOURS);
    });
  });
});
