import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { LabourReport, MyDay } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, signInAtKiosk, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/**
 * Done on a line nobody clocked on used to flag its book hours at once (and pay them on top of the idle
 * time). Now it waits for the foreman's sign-off, on the exceptions list, and stays out of flagged hours.
 */
describe('Done without clocked time', () => {
  let server: RunningServer;
  let kioskBrowser: BrowserContext;
  let officeBrowser: BrowserContext;
  let foreman: Api;
  beforeAll(async () => {
    server = await startServer();
    kioskBrowser = await openBrowser();
    officeBrowser = await openBrowser({ width: 1600, height: 1000 });
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await kioskBrowser?.close();
    await officeBrowser?.close();
    await server?.stop();
  });

  it('waits for the foreman’s sign-off and stays out of the flagged hours until then', async () => {
    const flagged = async (technicianId: number) =>
      (await foreman<LabourReport>('GET', '/reports/labour')).technicians.find(
        (row) => row.technicianId === technicianId,
      )!.flaggedHours;

    // Sam has a 2.6 h line assigned in the demo shop and has never clocked on it.
    const kiosk = await kioskBrowser.newPage();
    await signInAtKiosk(kiosk, server, '1046');
    const token = await kiosk.evaluate(
      () => JSON.parse(sessionStorage.getItem('baytime.kiosk.session') ?? '{}').accessToken as string,
    );
    const day = (await fetch(`${server.url}/api/me/day`, {
      headers: { authorization: `Bearer ${token}` },
    }).then((r) => r.json())) as MyDay;
    const line = day.lines.find((l) => l.title === 'Replace front struts')!;
    expect(line).toMatchObject({ mySeconds: 0, allSeconds: 0, bookHours: 2.6 });
    const before = await flagged(day.technician.id);

    await kiosk.locator('article', { hasText: line.title }).getByRole('button', { name: 'Done' }).click();
    await kiosk.getByLabel('Cause: what you found').fill('Both front strut mounts worn');
    await kiosk.getByLabel('Correction: what you did').fill('Replaced both front struts');
    await kiosk
      .getByRole('dialog')
      .getByRole('button', { name: /Final QC next/ })
      .click();
    await kiosk.getByRole('dialog').waitFor({ state: 'detached' });
    expect(await flagged(day.technician.id)).toBeCloseTo(before, 4);

    const office = await officeBrowser.newPage();
    await signInAtOffice(office, server, 'foreman@marlowcreek.test');
    await office.goto(`${server.url}/exceptions`);
    const row = office
      .getByRole('row', { name: /Done without clocked time/ })
      .filter({ hasText: line.title });
    await row.getByText('To resolve').waitFor();
    await office.screenshot({ path: screenshotPath('exceptions-done-unclocked') });
    await row.getByRole('button', { name: 'Sign off…' }).click();
    const dialog = office.getByRole('dialog');
    await dialog.getByRole('button', { name: 'Sign off' }).click();
    await dialog.getByText('Say why, in a few words').waitFor();
    await dialog.getByLabel('Reason').fill('Struts fitted before lunch; I checked the car');
    await dialog.getByRole('button', { name: 'Sign off' }).click();
    await dialog.waitFor({ state: 'detached' });
    // The dialog closed properly: the page is not left hidden from assistive technology.
    await expect.poll(() => office.locator('#root').getAttribute('aria-hidden')).toBeNull();
    await row.getByText('Resolved').waitFor();
    await row.getByText(/Signed off: Struts fitted before lunch; I checked the car · Theo Varga/).waitFor();

    // Signed off: its 2.6 book hours are flagged now.
    expect(await flagged(day.technician.id)).toBeCloseTo(before + 2.6, 4);
  });
});
