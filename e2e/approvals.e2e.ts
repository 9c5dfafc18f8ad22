import type { BrowserContext, Page as BrowserPage } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type {
  BoardSnapshot,
  MailboxEntry,
  MailboxMessage,
  Page,
  RepairOrderSummary,
  TextboxEntry,
} from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import {
  apiAs,
  bayTile,
  openWall,
  recordFinding,
  signInAtOffice,
  technicianDay,
  type Api,
} from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/** A 1×1 PNG: a real image, so the server's content check and preview both succeed. */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);
const LINK = /https?:\/\/\S+\/approve\/[A-Za-z0-9_-]{43}/;

describe('customer approval from a link', () => {
  let server: RunningServer;
  let office: BrowserContext;
  let wallBrowser: BrowserContext;
  let phone: BrowserContext;
  let owner: Api;
  beforeAll(async () => {
    server = await startServer();
    office = await openBrowser({ width: 1600, height: 1000 });
    wallBrowser = await openBrowser({ width: 1920, height: 1080 });
    phone = await openBrowser({ width: 390, height: 844 });
    owner = await apiAs(server, 'owner@marlowcreek.test');
  });
  afterAll(async () => {
    await office?.close();
    await wallBrowser?.close();
    await phone?.close();
    await server?.stop();
  });

  async function review(advisor: BrowserPage, note: string, wording: string, hours: string, parts: string) {
    const card = advisor
      .getByRole('list', { name: 'Findings waiting for an answer' })
      .locator('li', { hasText: note });
    await card.getByRole('button', { name: 'Review for the customer…' }).click();
    const dialog = advisor.getByRole('dialog', { name: 'For the customer' });
    await dialog.getByLabel('What the customer reads').fill(wording);
    await dialog.getByLabel('Book hours').fill(hours);
    await dialog.getByLabel('Parts ($)').fill(parts);
    await dialog.getByRole('button', { name: 'Save for the customer' }).click();
    await dialog.waitFor({ state: 'detached' });
    await card.getByText(wording).waitFor();
    return card;
  }

  it('an advisor sends the link by e-mail and text; the customer answers on a phone; the floor follows live', async () => {
    const { token: tech, day } = await technicianDay(server, '1041');
    const line = day.lines.find((l) => l.clockedOn)!;
    const held = { severity: 'soon', holdForApproval: 'true' };
    const magnet = await recordFinding(
      server,
      tech,
      line.id,
      { ...held, note: 'Shavings on the pan magnet, gasket weeping' },
      [{ name: 'pan.png', type: 'image/png', bytes: PNG }],
    );
    await recordFinding(server, tech, line.id, { ...held, note: 'Wiper blades torn' });
    const ro = await owner<RepairOrderSummary>('GET', `/repair-orders/${magnet.repairOrderId}`);

    const wall = await wallBrowser.newPage();
    await openWall(wall, server);
    await expect.poll(() => bayTile(wall, line.bayName!).textContent(), { timeout: 5000 }).toContain('Held');
    await wall.evaluate(() => Object.assign(window, { stillTheSamePage: true }));

    const advisor = await office.newPage();
    await signInAtOffice(advisor, server, 'advisor@marlowcreek.test');
    await advisor.goto(`${server.url}/findings`);
    const first = await review(
      advisor,
      'Shavings on the pan magnet',
      'The transmission pan gasket leaks: we advise a new gasket',
      '1.5',
      '42.80',
    );
    await review(advisor, 'Wiper blades torn', 'Both wiper blades are torn', '0.3', '24.00');
    // 1.5 h × $135.00 = $202.50 + $42.80 = $245.30 (worked by hand).
    await first.getByText('1.5 h + parts $42.80 = $245.30').waitFor();
    await first.getByRole('button', { name: 'Send approval link' }).click();
    await first
      .getByText(/^Approval link sent by e-mail to .+ and by text to \(\d{3}\) \d{3}-\d{4}, with 2 findings/)
      .waitFor();
    await advisor.screenshot({ path: screenshotPath('approval-inbox-sent') });

    // The e-mail and the text, each read from its local fake, carry the same link.
    let mail: MailboxEntry | undefined;
    await expect
      .poll(
        async () =>
          (mail = (await owner<Page<MailboxEntry>>('GET', '/mailbox')).items.find((m) =>
            m.subject.includes(`approval needed for RO ${ro.number}`),
          )),
        { timeout: 20_000 },
      )
      .toMatchObject({ to: [ro.customerEmail] });
    const mailText = (await owner<MailboxMessage>('GET', `/mailbox/${mail!.id}`)).text;
    const url = LINK.exec(mailText)?.[0];
    expect(url).toMatch(LINK);
    expect(mailText).not.toContain('Shavings on the pan magnet');
    let text: TextboxEntry | undefined;
    await expect
      .poll(
        async () =>
          (text = (await owner<Page<TextboxEntry>>('GET', '/textbox')).items.find((t) =>
            t.body.includes(url!),
          )),
        { timeout: 20_000 },
      )
      .toBeTruthy();
    expect(text!.to).toMatch(/^\+1\d{10}$/);

    // A phone-sized browser opens it, approves one, declines the other, and signs.
    const customer = await phone.newPage();
    await customer.goto(url!);
    await customer.getByRole('heading', { name: 'Marlow Creek Auto Care' }).waitFor();
    await customer.getByText('The transmission pan gasket leaks: we advise a new gasket').waitFor();
    await customer.getByText(/These prices are estimates/).waitFor();
    const photo = customer.getByRole('img', { name: /Photo 1 of item 1/ });
    await expect.poll(() => photo.evaluate((img: HTMLImageElement) => img.naturalWidth)).toBeGreaterThan(0);
    await customer
      .getByRole('radiogroup', { name: /item 1/ })
      .getByRole('radio', { name: 'Approve' })
      .check();
    await customer
      .getByRole('radiogroup', { name: /item 2/ })
      .getByRole('radio', { name: 'Decline' })
      .check();
    await customer.getByText('$245.30').first().waitFor();
    await customer.getByLabel(/Type your full name to sign/).fill('Harriet Quenby');
    await customer.screenshot({ path: screenshotPath('approval-phone'), fullPage: true });
    await customer.getByRole('button', { name: 'Send my answer' }).click();
    await customer.getByText('Thank you, Harriet Quenby').waitFor();
    await customer.screenshot({ path: screenshotPath('approval-phone-thanks') });

    // A new line waits in the queue, the hold is released, and the wall shows it without a reload.
    const after = await owner<RepairOrderSummary>('GET', `/repair-orders/${ro.id}`);
    const added = after.lines.filter((l) => !ro.lines.some((before) => before.id === l.id));
    expect(added).toMatchObject([
      {
        title: 'The transmission pan gasket leaks: we advise a new gasket',
        bookHours: 1.5,
        status: 'queued',
      },
    ]);
    const board = await owner<BoardSnapshot>('GET', '/board');
    expect(board.queue.map((item) => item.jobLineId)).toContain(added[0]!.id);
    expect(after.lines.find((l) => l.id === line.id)).toMatchObject({ status: 'queued', holdReason: null });
    await expect
      .poll(() => bayTile(wall, line.bayName!).textContent(), { timeout: 5000 })
      .not.toContain('Held');
    expect(await wall.evaluate(() => (window as { stillTheSamePage?: boolean }).stillTheSamePage)).toBe(true);

    // The advisor's inbox shows the answer without a reload.
    await advisor.getByRole('tab', { name: 'Answered' }).click();
    await advisor.getByText('Approved by Harriet Quenby through the approval link').first().waitFor();

    // The same link now answers 410, and the page says so.
    const token = url!.split('/approve/')[1]!;
    expect((await fetch(`${server.url}/api/public/approvals/${token}`)).status).toBe(410);
    await customer.reload();
    await customer.getByText('This link is closed').waitFor();
  });
});
