import { randomUUID } from 'node:crypto';
import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { BayDto, DispatchBoard, UserDto } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import {
  apiAs,
  bayTile,
  openWall,
  peopleStrip,
  signInAtKiosk,
  signInAtOffice,
  type Api,
} from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/**
 * The live path end to end: a kiosk tap shows on the wall with no reload. How fast is measured by
 * `npm run bench` (punch-to-board latency), not here: the waits below are only generous limits.
 */
describe('kiosk to wall board', () => {
  let server: RunningServer;
  let browser: BrowserContext;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    browser = await openBrowser();
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it("shows a technician's shift-in and clock-on on the wall without a reload", async () => {
    const jo = (await foreman<UserDto[]>('GET', '/users')).find((u) => u.name === 'Jo Whitfield')!;
    await foreman('POST', '/punches', { id: randomUUID(), kind: 'shift-out', technicianId: jo.id });

    const wall = await browser.newPage();
    await wall.setViewportSize({ width: 1920, height: 1080 });
    await openWall(wall, server);
    await wall.evaluate(() => ((window as unknown as { notReloaded: boolean }).notReloaded = true));
    await expect.poll(() => peopleStrip(wall).textContent()).not.toContain('Jo W.');

    const kiosk = await browser.newPage();
    await signInAtKiosk(kiosk, server, '1045');
    await kiosk.getByRole('button', { name: /Shift start/ }).click();
    // The strip turns a page every 5 s, so Jo shows within a round of its pages (six at most here).
    await expect.poll(() => peopleStrip(wall).textContent(), { timeout: 40_000 }).toContain('Jo W.');

    const dispatch = await foreman<DispatchBoard>('GET', '/dispatch');
    const line = dispatch.lanes
      .find((lane) => lane.technician.id === jo.id)!
      .lines.find((l) => l.bayId !== null)!;
    const bayName = dispatch.bays.find((b) => b.id === line.bayId)!.name;
    await kiosk
      .locator('li', { hasText: line.title })
      .getByRole('button', { name: /Clock on/ })
      .click();
    await expect.poll(() => bayTile(wall, bayName).textContent(), { timeout: 10_000 }).toMatch(/working/i);
    // Facts share a tile line and take turns every 5 s: the name shows within a few turns.
    await expect.poll(() => bayTile(wall, bayName).textContent(), { timeout: 30_000 }).toContain('Jo W.');
    expect(await wall.evaluate(() => (window as unknown as { notReloaded?: boolean }).notReloaded)).toBe(
      true,
    );
    await wall.screenshot({ path: screenshotPath('live-wall-1080p') });
    await kiosk.screenshot({ path: screenshotPath('live-kiosk') });
  }, 120_000);

  it('shows a bay added, then retired, on the open wall and in the office without a reload', async () => {
    const owner = await apiAs(server, 'owner@marlowcreek.test');
    const wall = await browser.newPage();
    await wall.setViewportSize({ width: 1920, height: 1080 });
    await openWall(wall, server);
    const office = await (await openBrowser({ width: 1440, height: 900 })).newPage();
    await signInAtOffice(office, server, 'owner@marlowcreek.test');
    // The office's live link is up (the dispatch page says so) before the bay is added.
    await office.goto(`${server.url}/dispatch`);
    await office
      .getByRole('status')
      .filter({ hasText: /^Online$/ })
      .waitFor();
    await office.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Bays' }).click();
    const bays = office.getByRole('table', { name: 'Bays' });
    await bays.waitFor();
    for (const page of [wall, office])
      await page.evaluate(() => ((window as unknown as { notReloaded: boolean }).notReloaded = true));

    const added = await owner<BayDto>('POST', '/bays', { name: 'Wash bay' });
    await bayTile(wall, 'Wash bay').waitFor({ timeout: 20_000 });
    await bays.getByRole('row', { name: /Wash bay/ }).waitFor({ timeout: 20_000 });

    await owner('PATCH', `/bays/${added.id}`, { active: false });
    await bayTile(wall, 'Wash bay').waitFor({ state: 'detached', timeout: 20_000 });
    await expect
      .poll(() => bays.getByRole('row', { name: /Wash bay/ }).textContent(), { timeout: 20_000 })
      .toContain('Retired');
    for (const page of [wall, office])
      expect(await page.evaluate(() => (window as unknown as { notReloaded?: boolean }).notReloaded)).toBe(
        true,
      );
    await office.context().close();
  });
});
