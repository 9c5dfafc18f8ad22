import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DispatchBoard, UserDto } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, bayTile, openWall, signInAtKiosk, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/**
 * A line waits for parts: the technician names the part at the kiosk, the office says when it is due,
 * the wall shows the due time and then "late" by itself, and once the parts are in the line goes back
 * to the technician, whose kiosk says so.
 */
describe('parts status', () => {
  let server: RunningServer;
  let kiosk: BrowserContext;
  let wall: BrowserContext;
  let office: BrowserContext;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    kiosk = await openBrowser();
    wall = await openBrowser({ width: 1920, height: 1080 });
    office = await openBrowser({ width: 1600, height: 1000 });
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await kiosk?.close();
    await wall?.close();
    await office?.close();
    await server?.stop();
  });

  it('holds a line for parts due in 20 seconds, shows due then late on the wall, and returns it when received', async () => {
    const dana = (await foreman<UserDto[]>('GET', '/users')).find((u) => u.name.startsWith('Dana'))!;
    const lane = (await foreman<DispatchBoard>('GET', '/dispatch')).lanes.find(
      (l) => l.technician.id === dana.id,
    )!;
    const line = lane.lines.find((l) => l.clockedOn.includes(dana.id))!;
    const board = await foreman<DispatchBoard>('GET', '/dispatch');
    const bayName = board.bays.find((b) => b.id === line.bayId)!.name;

    const tablet = await kiosk.newPage();
    await signInAtKiosk(tablet, server, '1041');
    const card = tablet.locator('article', { hasText: line.title });
    await card.getByRole('button', { name: 'Hold' }).click();
    await tablet.getByRole('button', { name: /Waiting for parts/ }).click();
    await tablet.getByLabel(/Which part is needed/).fill('Transmission pan gasket');
    await tablet.getByRole('button', { name: 'Hold for parts' }).click();
    await card.getByText('Waiting for Transmission pan gasket').waitFor();

    // The wall is open first, so the due time it shows can be near: the test then waits less.
    const screen = await wall.newPage();
    await openWall(screen, server);
    const tile = bayTile(screen, bayName);

    // The office says the parts come in 20 seconds.
    const due = new Date(Date.now() + 20_000);
    await foreman('PUT', `/job-lines/${line.id}/parts`, {
      part: 'Transmission pan gasket',
      state: 'ordered',
      supplier: 'Tallow Ridge Parts Supply',
      expectedAt: due.toISOString(),
    });
    const dueWords = new Intl.DateTimeFormat('en-US', {
      hour: 'numeric',
      minute: '2-digit',
      timeZone: 'America/Chicago',
    })
      .format(due)
      // The shop's 12-hour clock writes the day period in lower case: "5:58 am".
      .replace(/\b(AM|PM)$/, (period) => period.toLowerCase());

    await expect.poll(() => tile.textContent(), { timeout: 5000 }).toContain('Parts due');
    expect(await tile.textContent()).toContain(dueWords);
    await screen.screenshot({ path: screenshotPath('parts-due-wall') });
    // No message from the server: the wall's own clock (kept to the server's) flips the tile.
    await expect.poll(() => tile.textContent(), { timeout: 60_000, interval: 1000 }).toContain('Parts late');
    await screen.screenshot({ path: screenshotPath('parts-late-wall') });

    // Dana signs in again (unless the kiosk's idle time already signed her out) and stays on My day.
    const signOut = tablet.getByRole('button', { name: 'Sign out' });
    if (await signOut.isVisible()) await signOut.click();
    await signInAtKiosk(tablet, server, '1041');
    await card.getByText('Waiting for Transmission pan gasket · late').waitFor();
    const desk = await office.newPage();
    await signInAtOffice(desk, server, 'foreman@marlowcreek.test');
    await desk.goto(`${server.url}/dispatch`);
    await desk
      .getByRole('button', {
        name: `Parts for RO ${line.repairOrderNumber} line ${line.lineNo}: ${line.title}`,
      })
      .click();
    const dialog = desk.getByRole('dialog');
    expect(await dialog.getByLabel('Supplier').inputValue()).toBe('Tallow Ridge Parts Supply');
    await desk.screenshot({ path: screenshotPath('parts-dialog') });
    await dialog.getByRole('button', { name: 'Parts received' }).click();
    await dialog.waitFor({ state: 'detached' });

    await tablet
      .getByText(
        `Parts are in for RO ${line.repairOrderNumber} line ${line.lineNo} (Transmission pan gasket)`,
      )
      .waitFor();
    await card.getByRole('button', { name: /Clock on/ }).waitFor();
    await tablet.screenshot({ path: screenshotPath('parts-in-kiosk') });
    await expect.poll(() => tile.textContent(), { timeout: 5000 }).not.toContain('Parts');
  }, 150_000);
});
