import type { BrowserContext } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type {
  BoardSnapshot,
  FindingsPage,
  MailboxEntry,
  MyDay,
  Page,
  RepairOrderSummary,
} from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, signInAtKiosk, signInAtOffice, type Api } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/** A 1×1 PNG: a real image, so the server's content check and preview both succeed. */
const PNG = Buffer.from(
  'iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==',
  'base64',
);

describe('findings, approvals and e-mail', () => {
  let server: RunningServer;
  let kioskBrowser: BrowserContext;
  let officeBrowser: BrowserContext;
  let ownerBrowser: BrowserContext;
  let owner: Api;
  beforeAll(async () => {
    server = await startServer();
    kioskBrowser = await openBrowser();
    officeBrowser = await openBrowser({ width: 1600, height: 1000 });
    ownerBrowser = await openBrowser({ width: 1440, height: 900 });
    owner = await apiAs(server, 'owner@marlowcreek.test');
  });
  afterAll(async () => {
    await kioskBrowser?.close();
    await officeBrowser?.close();
    await ownerBrowser?.close();
    await server?.stop();
  });

  it('a finding with a photo reaches the advisor live, the approval request goes out by SMTP, and approving by phone frees the bay; another office window follows without a reload', async () => {
    const advisor = await officeBrowser.newPage();
    await signInAtOffice(advisor, server, 'advisor@marlowcreek.test');
    await advisor.goto(`${server.url}/findings`);
    await advisor
      .getByText(/no findings|nothing waiting/i)
      .or(advisor.getByRole('list', { name: 'Findings waiting for an answer' }))
      .first()
      .waitFor();
    // A second office window, on another page when the finding comes in.
    const other = await ownerBrowser.newPage();
    await signInAtOffice(other, server, 'owner@marlowcreek.test');
    await other.goto(`${server.url}/dispatch`);
    // The office's live link is up (the dispatch page says so) before the finding is sent.
    await other
      .getByRole('status')
      .filter({ hasText: /^Online$/ })
      .waitFor();
    await other.evaluate(() => ((window as unknown as { notReloaded: boolean }).notReloaded = true));

    const kiosk = await kioskBrowser.newPage();
    await signInAtKiosk(kiosk, server, '1041');
    const token = await kiosk.evaluate(
      () => JSON.parse(sessionStorage.getItem('baytime.kiosk.session') ?? '{}').accessToken as string,
    );
    const day = (await fetch(`${server.url}/api/me/day`, {
      headers: { authorization: `Bearer ${token}` },
    }).then((r) => r.json())) as MyDay;
    const line = day.lines.find((l) => l.clockedOn)!;
    const card = kiosk.locator('li', { hasText: line.title });
    await card.getByRole('button', { name: /Add finding/ }).click();
    await kiosk.getByLabel('What did you find?').fill('Metal shavings on the pan magnet; more than usual');
    await kiosk.getByRole('radio', { name: /Safety/ }).click();
    await kiosk.getByRole('switch', { name: /Hold this line for customer approval/ }).click();
    await kiosk
      .locator('input[type="file"]')
      .setInputFiles({ name: 'magnet.png', mimeType: 'image/png', buffer: PNG });
    await kiosk.getByRole('button', { name: 'Send finding' }).click();
    await kiosk.locator('.bt-finding-sent').or(kiosk.getByText(/sent/i)).first().waitFor();
    await kiosk.screenshot({ path: screenshotPath('finding-kiosk-sent') });

    // The advisor's inbox shows it without a reload, with its photo.
    const item = advisor
      .getByRole('list', { name: 'Findings waiting for an answer' })
      .locator('li', { hasText: 'Metal shavings' });
    await item.waitFor({ timeout: 5000 });
    await expect
      .poll(() => item.locator('img').first().getAttribute('src'), { timeout: 5000 })
      .toMatch(/^(blob|data):/);
    await advisor.screenshot({ path: screenshotPath('finding-inbox') });
    // Wherever the other window is, it is told: a toast, and a count on Findings.
    await other.getByText('A technician sent a finding', { exact: true }).waitFor({ timeout: 15_000 });
    const findingsMenu = other
      .getByRole('navigation', { name: 'Office' })
      .getByRole('link', { name: /Findings/ });
    await expect.poll(() => findingsMenu.textContent()).toBe('Findings1');
    await other.screenshot({ path: screenshotPath('finding-toast-office') });
    await findingsMenu.click();
    await other.getByRole('tab', { name: 'Answered' }).click();
    await other.getByText(/No answered findings yet/).waitFor();
    let board = await owner<BoardSnapshot>('GET', '/board');
    expect(board.bays.find((b) => b.name === line.bayName)).toMatchObject({
      state: 'held',
      holdReason: 'approval',
    });

    await item.getByRole('button', { name: 'Review for the customer…' }).click();
    const wording = advisor.getByRole('dialog', { name: 'For the customer' });
    await wording.getByLabel('What the customer reads').fill('Metal wear on the transmission pan magnet');
    await wording.getByLabel('Book hours').fill('1.2');
    await wording.getByRole('button', { name: 'Save for the customer' }).click();
    await wording.waitFor({ state: 'detached' });
    await item.getByRole('button', { name: 'Send approval link' }).click();
    const [finding] = (await owner<FindingsPage>('GET', '/findings?answer=pending')).items;
    const ro = await owner<RepairOrderSummary>('GET', `/repair-orders/${finding!.repairOrderId}`);
    await expect
      .poll(
        async () =>
          (await owner<Page<MailboxEntry>>('GET', '/mailbox')).items.find((m) =>
            m.subject.includes(`approval needed for RO ${ro.number}`),
          ),
        { timeout: 20_000 },
      )
      .toMatchObject({ to: [ro.customerEmail], attachments: [expect.stringMatching(/\.png$/)] });

    await item.getByRole('button', { name: /Customer approved/ }).click();
    await advisor.getByRole('radio', { name: 'By phone' }).check();
    await advisor.getByLabel('Book hours to charge').fill('1.2');
    await advisor.getByRole('button', { name: 'Add the line' }).click();
    await expect
      .poll(async () => (await owner<RepairOrderSummary>('GET', `/repair-orders/${ro.id}`)).lines.length)
      .toBe(ro.lines.length + 1);
    board = await owner<BoardSnapshot>('GET', '/board');
    expect(board.bays.find((b) => b.name === line.bayName)!.state).not.toBe('held');
    // The other window shows it answered, without a reload.
    await other.getByText(/Approved by Nell Ashby/).waitFor({ timeout: 15_000 });
    expect(await other.evaluate(() => (window as unknown as { notReloaded?: boolean }).notReloaded)).toBe(
      true,
    );
    const answered = (await owner<FindingsPage>('GET', '/findings?answer=approved')).items;
    expect(answered.find((f) => f.id === finding!.id)).toMatchObject({
      answerChannel: 'phone',
      answeredBy: 'Nell Ashby',
    });
  });

  it('refuses a renamed executable and an oversized photo, storing nothing', async () => {
    const kioskToken = (
      (await fetch(`${server.url}/api/auth/badge`, {
        method: 'POST',
        headers: { 'content-type': 'application/json' },
        body: JSON.stringify({ badge: '1042', pin: '4321' }),
      }).then((r) => r.json())) as { accessToken: string }
    ).accessToken;
    const day = (await fetch(`${server.url}/api/me/day`, {
      headers: { authorization: `Bearer ${kioskToken}` },
    }).then((r) => r.json())) as MyDay;
    const send = async (name: string, bytes: Buffer) => {
      const form = new FormData();
      form.set('note', 'Test upload');
      form.set('severity', 'watch');
      form.append('photos', new Blob([new Uint8Array(bytes)], { type: 'image/jpeg' }), name);
      const response = await fetch(`${server.url}/api/job-lines/${day.lines[0]!.id}/findings`, {
        method: 'POST',
        headers: { authorization: `Bearer ${kioskToken}` },
        body: form,
      });
      return { status: response.status, body: (await response.json()) as { message: string } };
    };
    const before = (await owner<FindingsPage>('GET', '/findings')).total;
    const exe = await send('photo.jpg', Buffer.concat([Buffer.from('MZ'), Buffer.alloc(2048, 1)]));
    expect(exe).toEqual({
      status: 400,
      body: expect.objectContaining({ message: 'Photo 1 is not a JPEG, PNG or WebP image' }),
    });
    const huge = await send('big.png', Buffer.concat([PNG, Buffer.alloc(11 * 1024 * 1024)]));
    expect(huge.status).toBe(413);
    expect(huge.body.message).toBe('Photo 1 is larger than 10 MB');
    expect((await owner<FindingsPage>('GET', '/findings')).total).toBe(before);
  });
});
