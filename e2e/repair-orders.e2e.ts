import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { Page as ListPage, RepairOrderSummary } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

type RepairOrderPage = ListPage<RepairOrderSummary>;

describe('the office list of repair orders', () => {
  let server: RunningServer;
  let office: BrowserContext;
  let advisor: Api;
  beforeAll(async () => {
    server = await startServer();
    office = await openBrowser({ width: 1600, height: 1000 });
    advisor = await apiAs(server, 'advisor@marlowcreek.test');
  });
  afterAll(async () => {
    await office?.close();
    await server?.stop();
  });

  it('pages and searches on the server, and shows book and clocked hours per RO', async () => {
    const page = await office.newPage();
    await signInAtOffice(page, server, 'advisor@marlowcreek.test');
    await page.goto(`${server.url}/repair-orders?status=all`);
    const firstPage = await advisor<RepairOrderPage>('GET', '/repair-orders?limit=50');
    const secondPage = await advisor<RepairOrderPage>(
      'GET',
      `/repair-orders?limit=50&cursor=${firstPage.nextCursor}`,
    );
    // The demo shop has a few hundred repair orders: more than one page.
    expect(firstPage.total).toBeGreaterThan(100);

    const count = page.getByRole('status').filter({ hasText: / of \d/ });
    const table = page.getByRole('table', { name: 'Repair orders' });
    const numbers = () => table.locator('tbody tr td:first-child').allTextContents();
    await expect.poll(() => count.textContent()).toBe(`1–50 of ${firstPage.total}`);
    expect(await numbers()).toEqual(firstPage.items.map((order) => order.number));

    // Each RO's clocked hours are its lines' clocked time as the server counts it (demo lines tick while
    // someone is on them: a few minutes of slack). The demo's first page has hours of work on it.
    const expected = firstPage.items.map(
      (order) => order.lines.reduce((sum, line) => sum + line.clockedSeconds, 0) / 3600,
    );
    expect(Math.max(...expected)).toBeGreaterThan(1);
    const column = (await table.getByRole('columnheader').allTextContents()).indexOf('Clocked');
    const shown = (await table.locator(`tbody tr td:nth-child(${column + 1})`).allTextContents()).map(
      (text) => Number.parseFloat(text),
    );
    expect(shown.map((hours, i) => (Math.abs(hours - expected[i]!) < 0.1 ? expected[i] : hours))).toEqual(
      expected,
    );

    // The range above the table always names the rows shown, never the page still loading.
    await page.getByRole('button', { name: 'Next' }).click();
    await expect.poll(() => count.textContent()).toBe(`51–100 of ${firstPage.total}`);
    expect(await numbers()).toEqual(secondPage.items.map((order) => order.number));
    await page.getByRole('button', { name: 'Previous' }).click();
    await expect.poll(() => count.textContent()).toBe(`1–50 of ${firstPage.total}`);

    // A customer from deeper in the list: the search goes to the server, not through the page shown.
    const customer = secondPage.items.at(-1)!.customerName;
    const found = await advisor<RepairOrderPage>(
      'GET',
      `/repair-orders?limit=50&q=${encodeURIComponent(customer)}`,
    );
    await page.getByRole('searchbox', { name: 'Search repair orders' }).fill(customer);
    await expect.poll(() => count.textContent()).toBe(`1–${found.items.length} of ${found.total}`);
    expect(await numbers()).toEqual(found.items.map((order) => order.number));
    expect(new URL(page.url()).searchParams.get('q')).toBe(customer);
    await page.screenshot({ path: screenshotPath('repair-orders-search') });
  });
});
