import type { BrowserContext, Locator, Page } from 'playwright-core';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import type { TimerDto } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { signInAtKiosk, technicianDay } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

const SMALL_TABLET = { width: 1024, height: 768 };

/** A set time started as the technician would from their kiosk, short enough for a test to wait out. */
async function startSetTime(server: RunningServer, token: string, jobLineId: number, seconds: number) {
  const response = await fetch(`${server.url}/api/timers`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
    body: JSON.stringify({ jobLineId, kind: 'set-time', durationSeconds: seconds, label: 'Sealant cure' }),
  });
  if (response.status !== 201)
    throw new Error(`timer not started: ${response.status} ${await response.text()}`);
  return (await response.json()) as TimerDto;
}

/** Badge and PIN on the keypad already showing: no reload, as on a tablet passed from hand to hand. */
async function badgeIn(page: Page, badge: string): Promise<void> {
  await page.keyboard.type(badge);
  await page.keyboard.press('Enter');
  await page.getByText('Now your PIN').waitFor();
  await page.keyboard.type('4321');
  await page.keyboard.press('Enter');
  await page.getByRole('button', { name: 'Sign out' }).waitFor();
}

async function signOut(page: Page): Promise<void> {
  await page.getByRole('button', { name: 'Sign out' }).click();
  await page.getByText('Sign in with your badge').waitFor();
}

/** The whole element lies on the screen: nothing to scroll to, nothing cut off. */
async function expectOnScreen(locator: Locator, page: Page): Promise<void> {
  const box = await locator.boundingBox();
  const screen = page.viewportSize()!;
  if (!box) throw new Error(`${String(locator)} is not on the page`);
  expect(box.y).toBeGreaterThanOrEqual(0);
  expect(box.y + box.height).toBeLessThanOrEqual(screen.height);
}

describe('a kiosk shared by the shop', () => {
  let server: RunningServer;
  let browser: BrowserContext | undefined;
  beforeAll(async () => {
    server = await startServer();
  });
  afterEach(async () => {
    await browser?.close();
    browser = undefined;
  });
  afterAll(async () => {
    await server?.stop();
  });

  it("chimes for Luis's set time, with his name and bay, after Sam signed in and out on the same tablet", async () => {
    browser = await openBrowser(SMALL_TABLET);
    const page = await browser.newPage();
    await signInAtKiosk(page, server, '1042');
    const { token, day } = await technicianDay(server, '1042');
    const line = day.lines.find((l) => l.clockedOn)!;
    await startSetTime(server, token, line.id, 20);
    await page.locator('li', { hasText: line.title }).getByText(/left/).waitFor();
    await signOut(page);
    await badgeIn(page, '1046');
    await signOut(page);

    const banner = page.getByRole('alert').filter({ hasText: 'set time over' });
    await banner.waitFor({ timeout: 40_000 });
    expect(await banner.textContent()).toContain(`Luis Brennan · ${line.bayName}: set time over`);
    await page.screenshot({ path: screenshotPath('kiosk-shared-timer-alert') });
  });

  it('asks about a counting timer at the shift’s end, and lets a finished one through a meal break', async () => {
    browser = await openBrowser(SMALL_TABLET);
    const page = await browser.newPage();
    await signInAtKiosk(page, server, '1041');
    const { token, day } = await technicianDay(server, '1041');
    const line = day.lines.find((l) => l.clockedOn)!;
    await startSetTime(server, token, line.id, 15);
    const card = page.locator('li', { hasText: line.title });
    await card.getByText(/left/).waitFor();

    await page.getByRole('button', { name: 'Shift end' }).click();
    const question = page.getByRole('dialog', { name: 'A timer is still running' });
    await question.getByText(/Nobody watches it after your shift ends/).waitFor();
    await expectOnScreen(question.getByRole('button', { name: /Leave it running/ }), page);
    await page.screenshot({ path: screenshotPath('kiosk-shift-end-timer-question') });
    await page.keyboard.press('Escape');
    await question.waitFor({ state: 'detached' });

    // The card counts down on the same clock as the question, a banner on one of its own.
    await card.getByText(/Time up at/).waitFor({ timeout: 30_000 });
    await page.getByRole('button', { name: 'Break start · meal' }).click();
    await page.getByRole('button', { name: 'Break end' }).waitFor();
    expect(await page.getByRole('dialog').count()).toBe(0);
  });

  it('fits every step of its sheets on a small tablet, and warns of the cooling system before a cool-down', async () => {
    browser = await openBrowser(SMALL_TABLET);
    const page = await browser.newPage();
    await signInAtKiosk(page, server, '1045');
    const card = page.getByRole('list', { name: 'My job lines' }).getByRole('listitem').first();
    const sheet = page.getByRole('dialog');

    await card.getByRole('button', { name: 'Done' }).click();
    await expectOnScreen(sheet.getByRole('button', { name: /Ready to go/ }), page);
    await expectOnScreen(sheet.getByRole('button', { name: /Final QC next/ }), page);
    await page.screenshot({ path: screenshotPath('kiosk-done-sheet-small') });
    await page.keyboard.press('Escape');
    await sheet.waitFor({ state: 'detached' });

    await card.getByRole('button', { name: 'Start timer' }).click();
    await sheet.getByRole('button', { name: /Cool-down to a temperature/ }).click();
    await sheet.getByText(/radiator cap/).waitFor();
    expect(await sheet.textContent()).not.toMatch(/engine runs/i);
    await expectOnScreen(sheet.getByRole('button', { name: /All checked/ }), page);
    await page.screenshot({ path: screenshotPath('kiosk-cool-down-caution') });
    await sheet.getByRole('button', { name: 'Back' }).click();
    await sheet.getByRole('button', { name: /^Set time/ }).click();
    await sheet.getByText(/job’s own cautions/).waitFor();
    await expectOnScreen(sheet.getByRole('button', { name: 'Start the timer' }), page);
  });
});
