import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { ShopSettings } from '@baytime/shared';
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
});
