import { randomUUID } from 'node:crypto';
import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { KioskDto, OfflinePunchDto, Page, Timecard, UserDto } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, openKiosk, openWall, signInAtKiosk, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/**
 * The shop's Wi-Fi drops before the morning shift: the kiosk still opens from the tablet, a technician
 * records a shift start with badge and PIN, and the server takes it, unverified, once the link is back;
 * it counts from the technician's next sign-in online.
 */
describe('kiosk through a Wi-Fi outage', () => {
  let server: RunningServer;
  let tablet: BrowserContext;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    tablet = await openBrowser();
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await tablet?.close();
    await server?.stop();
  });

  it('reloads offline to the sign-in, records a shift start offline, and confirms it at the next sign-in', async () => {
    const sam = (await foreman<UserDto[]>('GET', '/users')).find((u) => u.name.startsWith('Sam'))!;
    // Sam went home yesterday: off shift, so a shift start is what comes next.
    await foreman('POST', '/punches', { id: randomUUID(), kind: 'shift-out', technicianId: sam.id });
    const shiftInsBefore = (await card(foreman, sam.id)).punches.filter((p) => p.kind === 'shift-in').length;

    // The tablet was paired and in use while the link was up: the app and the server's key are on it.
    const kiosk = await tablet.newPage();
    await signInAtKiosk(kiosk, server, '1045');
    await kiosk.getByRole('button', { name: 'Sign out' }).click();
    await kiosk.getByText('Sign in with your badge').waitFor();
    // The service worker has the app shell and its assets on the tablet; from the next load on (a
    // tablet in use since yesterday) it serves the page.
    await kiosk.waitForFunction(() => navigator.serviceWorker.controller !== null);
    await kiosk.reload();
    await kiosk.getByText('Sign in with your badge').waitFor();
    await kiosk.waitForFunction(() => localStorage.getItem('baytime.kiosk.offline-key') !== null);

    await tablet.setOffline(true);
    await kiosk.reload();
    await kiosk.getByText('Sign in with your badge').waitFor();
    await kiosk.screenshot({ path: screenshotPath('kiosk-outage-reloaded') });

    const tappedFrom = Date.now();
    await kiosk.keyboard.type('1046');
    await kiosk.keyboard.press('Enter');
    await kiosk.getByText('PIN for badge 1046').waitFor();
    await kiosk.keyboard.type('4321');
    await kiosk.keyboard.press('Enter');
    const sheet = kiosk.getByRole('dialog', { name: /record a punch offline/ });
    await sheet.getByRole('button', { name: 'Shift start' }).click();
    await kiosk.getByText(/Shift start recorded offline for badge 1046/).waitFor();
    const tappedTo = Date.now();
    await kiosk.getByText('1 punch waiting to be sent').waitFor();
    await kiosk.screenshot({ path: screenshotPath('kiosk-outage-recorded') });
    expect(await offline(foreman)).toEqual([]);

    await tablet.setOffline(false);
    await kiosk.getByText(/waiting to be sent/).waitFor({ state: 'detached', timeout: 20_000 });
    const [arrived] = await offline(foreman);
    expect(arrived).toMatchObject({
      technicianId: sam.id,
      kind: 'shift-in',
      status: 'unverified',
      kioskName: 'e2e kiosk',
    });
    // The time tapped at the tablet, not the time the link came back.
    expect(Date.parse(arrived!.at)).toBeGreaterThanOrEqual(tappedFrom - 1000);
    expect(Date.parse(arrived!.at)).toBeLessThanOrEqual(tappedTo);
    expect(Date.parse(arrived!.receivedAt)).toBeGreaterThan(tappedTo);
    // Not counted yet.
    expect((await card(foreman, sam.id)).punches.filter((p) => p.kind === 'shift-in')).toHaveLength(
      shiftInsBefore,
    );

    await signInAtKiosk(kiosk, server, '1046');
    await expect.poll(async () => (await offline(foreman))[0]?.status).toBe('confirmed');
    const counted = (await card(foreman, sam.id)).punches.find((p) => p.id === arrived!.id);
    expect(counted).toMatchObject({ kind: 'shift-in', at: arrived!.at, recordedBy: sam.id });
    await kiosk
      .getByText(/On shift since/)
      .first()
      .waitFor();
    await kiosk.screenshot({ path: screenshotPath('kiosk-outage-confirmed') });
  }, 120_000);

  it('tells the wall and the office how many punches wait on the kiosk, and since when', async () => {
    const wall = await openBrowser({ width: 1920, height: 1080 });
    try {
      const kiosk = await tablet.newPage();
      await openKiosk(kiosk, server);
      await tablet.setOffline(true);
      await kiosk.keyboard.type('1044');
      await kiosk.keyboard.press('Enter');
      await kiosk.getByText('PIN for badge 1044').waitFor();
      await kiosk.keyboard.type('4321');
      await kiosk.keyboard.press('Enter');
      await kiosk.getByRole('button', { name: 'Break end' }).click();
      await kiosk.getByText('1 punch waiting to be sent').waitFor();
      // The Wi-Fi is back but the server cannot take the punch yet: the kiosk still says what waits.
      await tablet.route('**/api/kiosks/me/offline-punches', (route) =>
        route.fulfill({ status: 503, contentType: 'application/json', body: '{"message":"Busy"}' }),
      );
      await tablet.setOffline(false);
      const screen = await wall.newPage();
      await openWall(screen, server);
      await screen
        .getByText(/1 punch waiting since \d{1,2}:\d{2} [ap]m · e2e kiosk/)
        .waitFor({ timeout: 15_000 });
      await screen.screenshot({ path: screenshotPath('wall-kiosk-queue') });
      const [listed] = await foreman<KioskDto[]>('GET', '/kiosks');
      expect(listed!.queue.waiting).toBe(1);

      await tablet.unroute('**/api/kiosks/me/offline-punches');
      await kiosk.getByRole('button', { name: 'Send now' }).click();
      await kiosk.getByText(/waiting to be sent/).waitFor({ state: 'detached', timeout: 20_000 });
      await screen.getByText(/waiting since .* · e2e kiosk/).waitFor({ state: 'detached', timeout: 15_000 });
    } finally {
      await wall.close();
    }
  });

  it('opens the kiosk page on a fresh tablet to the pairing step', async () => {
    const fresh = await openBrowser();
    try {
      const page = await fresh.newPage();
      await page.goto(`${server.url}/kiosk/`);
      await page.getByText('Pair this tablet').waitFor();
      await openKiosk(page, server);
      expect(await page.evaluate(() => localStorage.getItem('baytime.kiosk.device'))).toMatch(/^ey/);
    } finally {
      await fresh.close();
    }
  });
});

async function card(api: Api, technicianId: number): Promise<Timecard> {
  return api<Timecard>('GET', `/timecards?technicianId=${technicianId}`);
}

async function offline(api: Api): Promise<OfflinePunchDto[]> {
  return (await api<Page<OfflinePunchDto>>('GET', '/offline-punches')).items;
}
