import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import {
  addIsoWeeks,
  workweekBounds,
  workweekName,
  workweekOf,
  type PayReport,
  type ShopSettings,
} from '@baytime/shared';
import { DEMO, nextEvent, startTestApp, type TestApp } from '../test-support/test-app.js';
import { ShopService } from './shop.service.js';

describe(ShopService.name, () => {
  let sut: TestApp;
  let owner: string;
  let technician: string;

  beforeAll(async () => {
    sut = await startTestApp();
    owner = await sut.signIn(DEMO.owner);
    technician = (await sut.badge(DEMO.badges[0])).accessToken;
  });
  afterAll(() => sut.close());

  it('tells every kiosk the saved settings, so the split rule and idle sign-out apply at once', async () => {
    const kiosk = sut.connect(technician);
    await nextEvent(kiosk, 'board.snapshot');
    const heard = nextEvent(kiosk, 'shop.updated');

    const { body } = await sut
      .http()
      .patch('/api/shop')
      .auth(owner, { type: 'bearer' })
      .send({ kioskIdleSeconds: 90, concurrentSplit: 'full' })
      .expect(200);

    const { shop } = await heard;
    expect(shop).toEqual(body as ShopSettings);
    expect(shop).toMatchObject({ kioskIdleSeconds: 90, concurrentSplit: 'full' });
  });

  it('says nothing when a save is refused', async () => {
    const kiosk = sut.connect(technician);
    await nextEvent(kiosk, 'board.snapshot');
    const heard = nextEvent(kiosk, 'shop.updated', () => true, 500).then(
      () => 'heard',
      () => 'silent',
    );
    await sut
      .http()
      .patch('/api/shop')
      .auth(owner, { type: 'bearer' })
      .send({ kioskIdleSeconds: 5 })
      .expect(400);
    expect(await heard).toBe('silent');
  });

  describe('a change of the workweek while pay weeks are closed', () => {
    let shop: ShopSettings;
    const weeks = { earlier: '', closed: '', next: '' };
    const patch = (body: Partial<ShopSettings>) =>
      sut.http().patch('/api/shop').auth(owner, { type: 'bearer' }).send(body);
    const pay = async (week: string) =>
      (await sut.http().get(`/api/reports/pay?week=${week}`).auth(owner, { type: 'bearer' }).expect(200))
        .body as PayReport;
    const reopen = (week: string, reason: string) =>
      sut
        .http()
        .post(`/api/pay-weeks/${week}/reopen`)
        .auth(owner, { type: 'bearer' })
        .send({ reason })
        .expect(200);
    const moves = (): Partial<ShopSettings>[] => [
      { workweekStartDay: (shop.workweekStartDay + 3) % 7 },
      { workweekStartHour: (shop.workweekStartHour + 6) % 24 },
      { timeZone: 'America/New_York' },
    ];

    // Ten weeks back, before the demo shop's punches: nothing there to resolve before closing.
    beforeAll(async () => {
      shop = (await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200))
        .body as ShopSettings;
      const current = workweekOf(new Date(), shop);
      [weeks.earlier, weeks.closed, weeks.next] = [-11, -10, -9].map((n) => addIsoWeeks(current, n)) as [
        string,
        string,
        string,
      ];
      for (const week of [weeks.earlier, weeks.closed])
        await sut
          .http()
          .post(`/api/pay-weeks/${week}/close`)
          .auth(owner, { type: 'bearer' })
          .send({})
          .expect(200);
    });

    it('refuses one that would move a closed week with 409 and a plain reason, and every week keeps its bounds', async () => {
      const name = workweekName(weeks.closed, shop, true);
      for (const change of moves()) {
        const { body } = await patch(change).expect(409);
        expect(body.message).toBe(
          `The workweek cannot change while pay weeks are closed under the current one: the closed ${name} and ` +
            '1 closed week before it would move, and hours already paid could be counted twice. Reopen those ' +
            'weeks first, or keep the current start day, hour and time zone',
        );
      }
      expect((await sut.http().get('/api/shop').auth(owner, { type: 'bearer' }).expect(200)).body).toEqual(
        shop,
      );
      const closed = workweekBounds(weeks.closed, shop);
      expect(await pay(weeks.closed)).toMatchObject({
        closed: true,
        from: closed.from.toISOString(),
        to: closed.to.toISOString(),
      });
      expect(await pay(weeks.next)).toMatchObject({ closed: false, from: closed.to.toISOString() });

      await reopen(weeks.earlier, 'Hours entered late');
      const { body } = await patch({ workweekStartHour: (shop.workweekStartHour + 1) % 24 }).expect(409);
      expect(body.message).toBe(
        `The workweek cannot change while pay weeks are closed under the current one: the closed ${name} would ` +
          'move, and hours already paid could be counted twice. Reopen it first, or keep the current start day, ' +
          'hour and time zone',
      );
    });

    it('takes one that keeps every closed week where it is, along with other settings', async () => {
      // The tz database's US/Central is another name for America/Chicago's rules.
      expect(shop.timeZone).toBe('America/Chicago');
      const { body } = await patch({
        workweekStartDay: shop.workweekStartDay,
        timeZone: 'US/Central',
        kioskIdleSeconds: 75,
      }).expect(200);
      expect(body).toMatchObject({ timeZone: 'US/Central', kioskIdleSeconds: 75 });
      await patch({ timeZone: shop.timeZone, kioskIdleSeconds: shop.kioskIdleSeconds }).expect(200);
    });

    it('takes one once no closed week would move', async () => {
      await reopen(weeks.closed, 'Moving the workweek');
      const [change] = moves();
      await patch(change!).expect(200);
      await patch({ workweekStartDay: shop.workweekStartDay }).expect(200);
    });
  });
});
