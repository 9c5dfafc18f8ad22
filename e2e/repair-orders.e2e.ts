import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFinished } from 'vitest';
import type { JobLineDto, Page as ListPage, RepairOrderSummary } from '@baytime/shared';
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

  it('leaves cancelled lines out of the book, keeps a change saved meanwhile, and reopens a done line', async () => {
    const owner = await apiAs(server, 'owner@marlowcreek.test');
    // 49 CFR 565.15 worked example: check digit X.
    const ro = await owner<RepairOrderSummary>('POST', '/repair-orders', {
      customer: { name: 'Perpetua Lindqvart' },
      vehicle: { vin: '1M8GDM9AXKP042788', year: 2019, make: 'Tarrow', model: 'Kestrel', odometer: 40_210 },
      concern: 'Wipers smear and the cabin filter is due',
      lines: [
        { title: 'Replace wiper blades', bookHours: 0.3 },
        { title: 'Replace cabin air filter', bookHours: 1.1 },
      ],
    });
    const [wipers, filter] = ro.lines;
    await owner<JobLineDto>('PATCH', `/job-lines/${wipers!.id}`, { status: 'done' });
    await owner<JobLineDto>('POST', `/job-lines/${filter!.id}/cancel`, {
      reason: 'Customer fitted one at home',
    });

    // A browser of its own: the list's already holds the advisor's session.
    const foremanDesk = await openBrowser({ width: 1600, height: 1000 });
    onTestFinished(() => foremanDesk.close());
    const page = await foremanDesk.newPage();
    await signInAtOffice(page, server, 'foreman@marlowcreek.test');
    await page.goto(`${server.url}/repair-orders/${ro.id}`);
    await page.getByText('0.3 h book').waitFor();
    await page.getByText(/1 of 1 lines done/).waitFor();

    // The line is edited here while someone else changes its book hours: only the title is sent.
    const row = page.getByRole('row', { name: /Replace wiper blades/ });
    await row.getByRole('button', { name: 'Edit', exact: true }).click();
    const edit = page.getByRole('dialog');
    await owner<JobLineDto>('PATCH', `/job-lines/${wipers!.id}/details`, { bookHours: 0.5 });
    await edit.getByLabel('Job').fill('Replace front wiper blades');
    await edit.getByRole('button', { name: 'Save line' }).click();
    await edit.waitFor({ state: 'detached' });
    await expect
      .poll(async () => (await owner<RepairOrderSummary>('GET', `/repair-orders/${ro.id}`)).lines[0])
      .toMatchObject({ title: 'Replace front wiper blades', bookHours: 0.5 });

    // A comeback: the done line goes back to the queue, after a confirmation.
    await page
      .getByRole('row', { name: /Replace front wiper blades/ })
      .getByRole('button', { name: 'Reopen (comeback)…' })
      .click();
    const confirm = page.getByRole('dialog');
    await confirm.getByText(/adjusted in the next open pay week/).waitFor();
    await confirm.getByRole('button', { name: 'Reopen the line' }).click();
    await confirm.waitFor({ state: 'detached' });
    await page.getByText(/0 of 1 lines done/).waitFor();
    const reopened = await owner<RepairOrderSummary>('GET', `/repair-orders/${ro.id}`);
    expect(reopened.lines[0]).toMatchObject({ status: 'queued', completedAt: null });
    expect(await page.getByRole('button', { name: 'Reopen (comeback)…' }).count()).toBe(0);
  });
});
