import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it, vi } from 'vitest';
import { ScreensService } from '../screens/screens.service.js';
import { DEMO, startTestApp, type TestApp } from '../test-support/test-app.js';
import { StartupService } from './startup.service.js';

describe(StartupService.name, () => {
  const dataDir = mkdtempSync(join(tmpdir(), 'baytime-startup-'));
  let sut: TestApp | null = null;
  const restart = async () => {
    await sut?.close();
    sut = await startTestApp({ BAYTIME_DATA_DIR: dataDir });
    return sut.app.get(ScreensService).list();
  };
  afterAll(async () => {
    await sut?.close();
    rmSync(dataDir, { recursive: true, force: true });
    vi.useRealTimers();
  });

  it('offers one wall screen for pairing however often the demo restarts', async () => {
    const first = await restart();
    expect(first).toHaveLength(1);
    expect(first[0]).toMatchObject({ name: 'Shop floor TV', pairedAt: null });

    // A code still waiting is left alone: it may be on its way to the TV.
    expect(await restart()).toEqual(first);

    // Once it has expired, the same screen gets a fresh code.
    vi.useFakeTimers({ toFake: ['Date'], shouldAdvanceTime: true });
    vi.setSystemTime(Date.parse(first[0]!.pairingExpiresAt!) + 60_000);
    const renewed = await restart();
    expect(renewed.map((screen) => screen.id)).toEqual([first[0]!.id]);
    expect(Date.parse(renewed[0]!.pairingExpiresAt!)).toBeGreaterThan(
      Date.parse(first[0]!.pairingExpiresAt!),
    );
  });

  it('offers none once a screen is paired', async () => {
    const owner = await sut!.signIn(DEMO.owner);
    const { body: pairing } = await sut!
      .http()
      .post('/api/screens')
      .auth(owner, { type: 'bearer' })
      .send({ name: 'Office TV' })
      .expect(201);
    await sut!.http().post('/api/auth/screens/pair').send({ code: pairing.code }).expect(200);
    const before = sut!.app.get(ScreensService).list();
    vi.setSystemTime(Date.now() + 60 * 60_000);
    expect(await restart()).toEqual(before);
  });
});
