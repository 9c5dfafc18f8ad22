import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { DispatchBoard, RepairOrderSummary } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, bayTile, openWall, signInAtKiosk, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

// The widely used worked example of the 49 CFR 565.15 check digit: 1M8GDM9AXKP042788, check digit X;
// model year code K.
const VIN = '1M8GDM9AXKP042788';
const WRONG_VIN = '1M8GDM9A4KP042788';
// The same VIN as printed in groups on a document, pasted whole.
const PASTED_VIN = '1M8 GDM9A-XKP 042788';
const FAR_PAST = { date: '2021-03-01', time: '09:00' };

describe('repair-order intake and dispatch', () => {
  let server: RunningServer;
  let office: BrowserContext;
  let kiosks: BrowserContext;
  let foremanApi: Api;
  beforeAll(async () => {
    server = await startServer();
    office = await openBrowser({ width: 1600, height: 1000 });
    kiosks = await openBrowser();
    foremanApi = await apiAs(server, 'foreman@marlowcreek.test');
    // Bay 3 holds a car waiting for parts in the demo: move it out so the bay is free for this RO.
    const board = await foremanApi<DispatchBoard>('GET', '/dispatch');
    const bay3 = board.bays.find((b) => b.name === 'Bay 3')!;
    for (const lane of board.lanes)
      for (const line of lane.lines)
        if (line.bayId === bay3.id) await foremanApi('PATCH', `/job-lines/${line.id}`, { bayId: null });
    await foremanApi('POST', `/bays/${bay3.id}/release`);
  });
  afterAll(async () => {
    await office?.close();
    await kiosks?.close();
    await server?.stop();
  });

  it('writes an RO, assigns line 1 to a tech in bay 3 live, and moves it to another tech', async () => {
    const advisor = await office.newPage();
    await signInAtOffice(advisor, server, 'advisor@marlowcreek.test');
    await advisor.goto(`${server.url}/repair-orders/new`);
    await advisor.getByLabel('Name').fill('Wendell Farrow');
    await advisor.getByLabel('Phone').fill('(608) 555-0142');
    await advisor.getByLabel('E-mail').fill('wendell@example.test');
    await advisor.getByLabel('VIN').fill(WRONG_VIN);
    await advisor.getByText('Check digit should be X, not 4').waitFor();
    await advisor.screenshot({ path: screenshotPath('intake-wrong-vin') });
    await advisor.getByLabel('VIN').fill(PASTED_VIN);
    expect(await advisor.getByLabel('VIN').inputValue()).toBe(VIN);
    await advisor.getByText(/Check digit correct/).waitFor();
    await advisor.getByLabel('Make').fill('Halvard');
    await advisor.getByLabel(/^Model\s*\*?$/).fill('Morrow');
    await advisor.getByLabel(/Odometer/).fill('61200');
    await advisor.getByLabel('What the customer asked for').fill('Shudder pulling away; due for service');
    const line1 = advisor.getByRole('group', { name: 'Line 1' });
    await line1.getByPlaceholder(/Search the menu/).fill('Inspect engine and transmission mounts');
    await line1.getByLabel('Book hours').fill('0.8');
    await advisor.getByRole('button', { name: 'Add a line' }).click();
    const line2 = advisor.getByRole('group', { name: 'Line 2' });
    await line2.getByPlaceholder(/Search the menu/).fill('Road test and report');
    await line2.getByLabel('Line 2 book hours').fill('0.5');
    // A promise already past is refused at the field before anything is sent.
    await advisor.getByRole('textbox', { name: 'Promised date' }).fill(FAR_PAST.date);
    await advisor.getByRole('textbox', { name: 'Promised time' }).fill(FAR_PAST.time);
    await advisor.getByRole('button', { name: 'Write repair order' }).click();
    await advisor.getByText('That time has already passed: promise a later one').first().waitFor();
    expect(advisor.url()).toMatch(/\/repair-orders\/new$/);
    await advisor.getByRole('textbox', { name: 'Promised date' }).fill('');
    await advisor.getByRole('textbox', { name: 'Promised time' }).fill('');
    await advisor.getByRole('button', { name: 'Write repair order' }).click();
    await advisor.waitForURL(/\/repair-orders\/\d+$/);
    const roId = Number(new URL(advisor.url()).pathname.split('/').pop());
    await advisor.screenshot({ path: screenshotPath('intake-written') });

    const ro = (await foremanApi<DispatchBoard>('GET', '/dispatch')).queue.filter(
      (l) => l.repairOrderId === roId,
    );
    expect(ro.map((l) => l.title)).toEqual([
      'Inspect engine and transmission mounts',
      'Road test and report',
    ]);
    const line = ro.find((l) => l.lineNo === 1)!;

    const jo = await kiosks.newPage();
    await signInAtKiosk(jo, server, '1045');
    const sam = await kiosks.newPage();
    await signInAtKiosk(sam, server, '1046');
    const wall = await office.newPage();
    await wall.setViewportSize({ width: 1920, height: 1080 });
    await openWall(wall, server);

    const foremanDesk = await openBrowser({ width: 1600, height: 1000 });
    const foreman = await foremanDesk.newPage();
    await signInAtOffice(foreman, server, 'foreman@marlowcreek.test');
    await foreman.goto(`${server.url}/dispatch`);
    const move = (name: RegExp) => foreman.getByRole('button', { name }).first();
    const menuFor = new RegExp(`Move line 1, .*RO ${line.repairOrderNumber}`);

    await move(menuFor).click();
    await foreman.getByRole('menuitem', { name: 'Bay' }).click();
    await foreman.getByRole('menuitemradio', { name: /^Bay 3/ }).click();
    await expect.poll(() => bayTile(wall, 'Bay 3').textContent(), { timeout: 3000 }).toMatch(/staged/i);

    await move(menuFor).click();
    await foreman.getByRole('menuitemradio', { name: /Jo Whitfield/ }).click();
    await jo.getByText(line.title).waitFor();
    expect(await bayTile(wall, 'Bay 3').textContent()).toMatch(/staged/i);
    await foreman.screenshot({ path: screenshotPath('dispatch-assigned') });
    await wall.screenshot({ path: screenshotPath('dispatch-wall-bay3-staged') });

    await move(menuFor).click();
    await foreman.getByRole('menuitemradio', { name: /Sam Ortega/ }).click();
    await sam.getByText(line.title).waitFor();
    await jo.getByText(line.title).waitFor({ state: 'detached' });
    await sam.screenshot({ path: screenshotPath('dispatch-kiosk-sam') });
    await foremanDesk.close();
  });

  it('brings back a returning customer from the VIN, and saves a VIN outside the rules with a reason', async () => {
    // The office browser is still signed in as the advisor from the first test.
    const advisor = await office.newPage();
    await advisor.goto(`${server.url}/repair-orders/new`);
    await advisor.getByLabel('VIN').fill(VIN);
    const seen = advisor.getByRole('status').filter({ hasText: 'Seen before' });
    await seen.getByText(/Wendell Farrow, 61,200/).waitFor();
    await seen.getByRole('button', { name: 'Use Wendell Farrow’s details' }).click();
    expect(await advisor.getByLabel('Name').inputValue()).toBe('Wendell Farrow');
    expect(await advisor.getByLabel('Phone').inputValue()).toBe('(608) 555-0142');
    expect(await advisor.getByLabel('E-mail').inputValue()).toBe('wendell@example.test');
    expect(await advisor.getByLabel('Make').inputValue()).toBe('Halvard');
    expect(await advisor.getByLabel(/^Model\s*\*?$/).inputValue()).toBe('Morrow');
    await advisor.screenshot({ path: screenshotPath('intake-returning-customer') });

    // An imported car whose maker uses no check digit: offered an override only once the save is refused.
    await advisor.getByLabel('VIN').fill(WRONG_VIN);
    await advisor.getByLabel(/Odometer/).fill('61500');
    await advisor.getByLabel('What the customer asked for').fill('Brakes squeal');
    const line1 = advisor.getByRole('group', { name: 'Line 1' });
    await line1.getByPlaceholder(/Search the menu/).fill('Inspect brakes');
    await line1.getByLabel('Book hours').fill('0.5');
    expect(await advisor.getByRole('button', { name: 'Save with this VIN' }).count()).toBe(0);
    await advisor.getByRole('button', { name: 'Write repair order' }).click();
    await advisor.getByLabel(/Say why this VIN is right/).fill('Imported: the maker uses no check digit');
    await advisor.screenshot({ path: screenshotPath('intake-vin-override') });
    await advisor.getByRole('button', { name: 'Save with this VIN' }).click();
    await advisor.waitForURL(/\/repair-orders\/\d+$/);
    const roId = Number(new URL(advisor.url()).pathname.split('/').pop());
    expect(await foremanApi<RepairOrderSummary>('GET', `/repair-orders/${roId}`)).toMatchObject({
      vin: WRONG_VIN,
      customerName: 'Wendell Farrow',
    });
  });
});
