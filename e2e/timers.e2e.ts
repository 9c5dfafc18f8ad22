import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BoardSnapshot, MyDay } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, bayTile, openWall, signInAtKiosk, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/**
 * A warm-up started at the kiosk: readings give an ETA on the wall, the timer survives a server
 * restart (everything is computed from stored start and readings), and the target reading ends it.
 * Common practice, no published source: some automatic transmissions have their fluid level set at
 * about 45 °C with the engine running; the tech enters the maker's figure, Baytime suggests none.
 */
describe('warm-up timer', () => {
  let server: RunningServer;
  let browser: BrowserContext;
  let owner: Api;
  beforeAll(async () => {
    server = await startServer();
    browser = await openBrowser();
    owner = await apiAs(server, 'owner@marlowcreek.test');
    await owner('PATCH', '/shop', { units: 'metric' });
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it('shows an ETA on the wall, survives a restart, and says when the target is reached', async () => {
    const wall = await browser.newPage();
    await wall.setViewportSize({ width: 1920, height: 1080 });
    await openWall(wall, server);
    const kiosk = await browser.newPage();
    await signInAtKiosk(kiosk, server, '1041');
    const dana = await kiosk.evaluate(() =>
      JSON.parse(sessionStorage.getItem('baytime.kiosk.session') ?? '{}'),
    );
    const day = (await fetch(`${server.url}/api/me/day`, {
      headers: { authorization: `Bearer ${dana.accessToken}` },
    }).then((r) => r.json())) as MyDay;
    const line = day.lines.find((l) => l.clockedOn)!;
    const card = kiosk.locator('li', { hasText: line.title });

    await card.getByRole('button', { name: /Start timer/ }).click();
    await kiosk.getByRole('button', { name: /Warm-up to a temperature/ }).click();
    await kiosk.getByText('Use the temperature from the vehicle maker’s procedure').waitFor();
    await kiosk.getByRole('button', { name: /All checked/ }).click();
    await kiosk.keyboard.type('45');
    await kiosk.getByRole('button', { name: /Start warm-up/ }).click();

    const logReading = async (value: string) => {
      await card.getByRole('button', { name: /Log reading/ }).click();
      await kiosk.getByText('Log a reading').waitFor();
      await kiosk.keyboard.type(value);
      await kiosk.getByRole('button', { name: 'Save reading' }).click();
      await kiosk.getByText('Log a reading').waitFor({ state: 'detached' });
    };
    await logReading('30');
    await kiosk.waitForTimeout(20_000);
    await logReading('36');

    const bay = line.bayName!;
    await expect.poll(() => bayTile(wall, bay).textContent(), { timeout: 3000 }).toMatch(/timer/i);
    await expect.poll(() => bayTile(wall, bay).textContent(), { timeout: 6000 }).toMatch(/\d+:\d\d\s*left/);
    await wall.screenshot({ path: screenshotPath('timer-wall-eta') });
    await kiosk.screenshot({ path: screenshotPath('timer-kiosk-eta') });

    const beforeRestart = (await owner<BoardSnapshot>('GET', '/board')).bays.find((b) => b.name === bay)!;
    expect(beforeRestart.timer!.etaAt).toMatch(/^\d{4}-\d\d-\d\dT\d\d:\d\d:\d\d\.\d{3}Z$/);
    await server.restart();
    owner = await apiAs(server, 'owner@marlowcreek.test');
    const afterRestart = (await owner<BoardSnapshot>('GET', '/board')).bays.find((b) => b.name === bay)!;
    // The ETA is computed from the stored readings alone: the same instant after the restart.
    expect(afterRestart).toMatchObject({
      state: 'timer',
      timer: { kind: 'warm-up', targetC: 45, lastReadingC: 36, etaAt: beforeRestart.timer!.etaAt },
    });
    await expect.poll(() => bayTile(wall, bay).textContent(), { timeout: 20_000 }).toMatch(/left|due now/i);

    await kiosk.reload();
    await card.getByRole('button', { name: /Log reading/ }).waitFor({ timeout: 20_000 });
    await logReading('45');
    const reached = (await owner<BoardSnapshot>('GET', '/board')).bays.find((b) => b.name === bay)!;
    expect(reached.timer).toMatchObject({ reached: true, lastReadingC: 45 });
    await expect.poll(() => bayTile(wall, bay).textContent(), { timeout: 20_000 }).toMatch(/reached/i);
    await expect.poll(() => kiosk.textContent('body'), { timeout: 6000 }).toMatch(/reached/i);
    await wall.screenshot({ path: screenshotPath('timer-wall-reached') });
    await kiosk.screenshot({ path: screenshotPath('timer-kiosk-reached') });
  });
});
