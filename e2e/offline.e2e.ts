import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DispatchBoard, Timecard, UserDto } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, bayTile, openWall, signInAtKiosk, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/**
 * Shop Wi-Fi drops: punches tapped offline wait in the kiosk's outbox, keep their tapped times, and
 * reach the server exactly once when the link is back.
 */
describe('kiosk offline', () => {
  let server: RunningServer;
  let kioskBrowser: BrowserContext;
  let wallBrowser: BrowserContext;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    kioskBrowser = await openBrowser();
    wallBrowser = await openBrowser({ width: 1920, height: 1080 });
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await kioskBrowser?.close();
    await wallBrowser?.close();
    await server?.stop();
  });

  it('sends punches tapped offline once each, with their tapped times, and the wall shows the result', async () => {
    const jo = (await foreman<UserDto[]>('GET', '/users')).find((u) => u.name === 'Jo Whitfield')!;
    const before = await foreman<DispatchBoard>('GET', '/dispatch');
    const first = before.lanes.find((lane) => lane.technician.id === jo.id)!.lines[0]!;
    const queued = before.queue.at(-1)!;
    const freeBay = before.bays.find((b) => b.state === 'free')!;
    await foreman('PATCH', `/job-lines/${queued.id}`, { technicianId: jo.id, bayId: freeBay.id });

    const wall = await wallBrowser.newPage();
    await openWall(wall, server);
    const kiosk = await kioskBrowser.newPage();
    await signInAtKiosk(kiosk, server, '1045');
    await kiosk
      .locator('li', { hasText: first.title })
      .getByRole('button', { name: /Clock on/ })
      .click();
    await expect
      .poll(async () => (await card(foreman, jo.id)).punches.filter((p) => p.jobLineId === first.id).length)
      .toBe(1);

    await kioskBrowser.setOffline(true);
    const offlineFrom = Date.now();
    await kiosk
      .locator('li', { hasText: queued.title })
      .getByRole('button', { name: /Clock on/ })
      .click();
    await kiosk.getByText('2 punches waiting to be sent').waitFor();
    await kiosk.screenshot({ path: screenshotPath('kiosk-offline-outbox') });
    const offlineTo = Date.now();
    await new Promise((r) => setTimeout(r, 1500));
    expect((await card(foreman, jo.id)).punches.filter((p) => p.jobLineId === queued.id)).toHaveLength(0);

    await kioskBrowser.setOffline(false);
    await kiosk.getByText(/waiting to be sent/).waitFor({ state: 'detached', timeout: 20_000 });

    const punches = (await card(foreman, jo.id)).punches.filter(
      (p) => new Date(p.at).getTime() >= offlineFrom - 60_000,
    );
    const jobPunches = punches.filter((p) => p.kind === 'job-on' || p.kind === 'job-off');
    expect(jobPunches.map((p) => [p.kind, p.jobLineId])).toEqual([
      ['job-on', first.id],
      ['job-off', first.id],
      ['job-on', queued.id],
    ]);
    expect(new Set(punches.map((p) => p.id)).size).toBe(punches.length);
    for (const punch of jobPunches.slice(1)) {
      // The tapped time, not the time the link came back.
      expect(new Date(punch.at).getTime()).toBeGreaterThanOrEqual(offlineFrom);
      expect(new Date(punch.at).getTime()).toBeLessThanOrEqual(offlineTo);
      expect(new Date(punch.recordedAt).getTime()).toBeGreaterThan(offlineTo);
    }
    await expect.poll(() => bayTile(wall, freeBay.name).textContent(), { timeout: 3000 }).toMatch(/working/i);
    await wall.screenshot({ path: screenshotPath('offline-wall-after') });
  });
});

async function card(api: Api, technicianId: number): Promise<Timecard> {
  return api<Timecard>('GET', `/timecards?technicianId=${technicianId}`);
}
