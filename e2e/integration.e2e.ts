import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { makeVin, RO_IMPORT_COLUMNS, type RepairOrderSummary, type WebhookEnvelope } from '@baytime/shared';
import { startHttpsReceiver, type HttpsReceiver } from '../server/src/test-support/https-receiver.js';
import { verifyWebhook } from '../server/src/webhooks/webhook-signature.js';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/** Two ROs from another system: the first with two job lines. */
const TWO_ROS = [
  RO_IMPORT_COLUMNS.join(','),
  `DMS-5001,Ottilie Brask,608-555-0150,,${makeVin('2HGFE2F5N1000001')},2022,Corvane,Ridgeback,,21000,Rattle from the rear,,Inspect rear exhaust hangers,0.6`,
  `DMS-5001,,,,,,,,,,,,Replace rear hanger,0.4`,
  `DMS-5002,Cyrus Penwarden,608-555-0151,,${makeVin('4T1BK1EBP2000002')},2023,Halvard,Tessel,,9000,Scheduled service,,Oil and filter service,0.7`,
].join('\n');

describe('the shop beside its other systems', () => {
  let server: RunningServer;
  let receiver: HttpsReceiver;
  let browser: BrowserContext;
  let page: Page;
  let foreman: Api;

  /** What a field the page shows once holds (a new key, a signing secret). */
  const shownOnce = (label: string) => page.getByLabel(label, { exact: true }).inputValue();

  beforeAll(async () => {
    receiver = await startHttpsReceiver();
    server = await startServer({ BAYTIME_WEBHOOK_CA_FILE: receiver.caFile });
    browser = await openBrowser({ width: 1440, height: 1000 });
    page = await browser.newPage();
    foreman = await apiAs(server, 'foreman@marlowcreek.test');
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
    await receiver?.close();
  });

  it('renders the API reference at /api/docs within the content security policy', async () => {
    const refused: string[] = [];
    const docs = await browser.newPage();
    docs.on('console', (message) => {
      if (message.type() === 'error') refused.push(message.text());
    });
    docs.on('requestfailed', (request) => refused.push(`${request.url()} ${request.failure()?.errorText}`));
    await docs.goto(`${server.url}/api/docs`);
    await docs.locator('.swagger-ui .info .title', { hasText: 'Baytime API' }).waitFor();
    await docs.locator('.opblock-summary-path', { hasText: '/api/repair-orders' }).first().waitFor();
    await docs.screenshot({ path: screenshotPath('api-docs'), fullPage: false });
    expect(refused).toEqual([]);
    await docs.close();
  });

  it('imports two ROs from CSV, takes an RO from a key, signs a webhook, and refuses a revoked key', async () => {
    await signInAtOffice(page, server, 'owner@marlowcreek.test');

    // Webhooks: register the receiver for finished lines; its signing secret is shown once.
    await page.getByRole('link', { name: 'Webhooks' }).click();
    await page.getByLabel('Address').fill(receiver.url);
    await page.getByRole('checkbox', { name: /A job line is finished/ }).check();
    await page.getByRole('button', { name: 'Register endpoint' }).click();
    const signingSecret = await shownOnce('Signing secret');
    expect(signingSecret).toMatch(/^whsec_/);

    // Integration keys: one that may write ROs.
    await page.getByRole('link', { name: 'Integration keys' }).click();
    await page.getByRole('textbox', { name: /^Name/ }).fill('Counter system');
    await page.getByRole('checkbox', { name: /repair-orders:write/ }).check();
    await page.getByRole('button', { name: 'Make key' }).click();
    const key = await shownOnce('Integration key');
    expect(key).toMatch(/^btk_/);
    await page.screenshot({ path: screenshotPath('integration-keys'), fullPage: true });

    // CSV import: the preview names both ROs before anything is saved, then the import saves them.
    await page.getByRole('link', { name: 'Repair orders' }).click();
    await page.getByRole('button', { name: 'Import from CSV' }).click();
    await page
      .getByLabel('CSV file')
      .setInputFiles({ name: 'dms-export.csv', mimeType: 'text/csv', buffer: Buffer.from(TWO_ROS) });
    const preview = page.getByRole('table', { name: 'Repair orders in the file' });
    await preview.waitFor();
    expect(await preview.getByText('New').count()).toBe(2);
    await page.screenshot({ path: screenshotPath('ro-import-preview'), fullPage: true });
    await page.getByRole('button', { name: 'Import 2 repair orders' }).click();
    const imported = page.getByRole('table', { name: 'Imported repair orders' });
    await imported
      .getByRole('link', { name: /^RO \d+$/ })
      .nth(1)
      .waitFor();
    const listed = await foreman<{ items: RepairOrderSummary[] }>('GET', '/repair-orders?q=Ottilie');
    expect(listed.items.map((ro) => [ro.externalRef, ro.lines.length])).toEqual([['DMS-5001', 2]]);

    // The key writes an RO; a line of it finished by the foreman reaches the receiver, signed.
    const sent = await fetch(`${server.url}/api/repair-orders`, {
      method: 'POST',
      headers: { authorization: `Bearer ${key}`, 'content-type': 'application/json' },
      body: JSON.stringify({
        externalRef: 'DMS-5003',
        customer: { name: 'Wren Alcott' },
        vehicle: {
          vin: makeVin('1FTEW1EPN3000003'),
          year: 2022,
          make: 'Corvane',
          model: 'Hauler',
          odometer: 15000,
        },
        concern: 'Wipers smear',
        lines: [{ title: 'Replace wiper blades', bookHours: 0.3 }],
      }),
    });
    expect(sent.status, await sent.clone().text()).toBe(201);
    const ro = (await sent.json()) as RepairOrderSummary;
    await foreman('PATCH', `/job-lines/${ro.lines[0]!.id}`, { status: 'done' });
    const hook = await receiver.next(
      (h) => (JSON.parse(h.body) as WebhookEnvelope).event === 'job-line.finished',
    );
    const [timestamp, signature] = [hook.headers['x-baytime-timestamp'], hook.headers['x-baytime-signature']];
    expect(verifyWebhook(signingSecret, String(timestamp), hook.body, String(signature))).toBe(true);
    expect((JSON.parse(hook.body) as WebhookEnvelope<'job-line.finished'>).data).toMatchObject({
      jobLineId: ro.lines[0]!.id,
      externalRef: 'DMS-5003',
    });
    await page.getByRole('link', { name: 'Webhooks' }).click();
    await page.getByRole('table', { name: 'Webhook deliveries' }).getByText('Delivered').first().waitFor();

    // Revoked in the office, the key is refused.
    await page.getByRole('link', { name: 'Integration keys' }).click();
    await page.getByRole('button', { name: 'Revoke Counter system' }).click();
    await page.getByRole('button', { name: 'Revoke key' }).click();
    await page.getByText(/^Revoked /).waitFor();
    const refused = await fetch(`${server.url}/api/repair-orders?limit=1`, {
      headers: { authorization: `Bearer ${key}` },
    });
    expect(refused.status).toBe(401);
  });
});
