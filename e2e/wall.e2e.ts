import { randomUUID } from 'node:crypto';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BAY_STATE_WORDS, type BoardSnapshot, type UserDto } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { apiAs, bayTile, openWall, peopleStrip, technicianDay, type Api } from './support/floor.js';
import { flaws } from './support/flaws.js';
import { pairingCode, startServer, type RunningServer } from './support/server.js';

/**
 * DISPLAY.md: body text cap height ≥ 55 px at 1080p, never below 44 px, scaled with the viewport
 * (16′–22′ of visual angle at 6 m on a 55-inch TV). Barlow's cap height is 0.7 em (its font metrics:
 * 700 of 1000 units), so a text's cap height is 0.7 × its computed font size. Tiles keep the 55 px
 * while 8 share a page and shrink toward the 44 px floor when more do.
 */
const CAP_HEIGHT_EM = 0.7;
const PREFERRED_CAP_AT_1080P = 55;
const MIN_CAP_AT_1080P = 44;

/** No scrolling, no text under the legible size, and nothing cut or clipped. */
async function assertLegibleAndStill(page: Page, height: number, minCapAt1080p: number): Promise<void> {
  const scroll = await page.evaluate(() => ({
    w: document.documentElement.scrollWidth,
    h: document.documentElement.scrollHeight,
    vw: window.innerWidth,
    vh: window.innerHeight,
  }));
  expect(scroll.w).toBeLessThanOrEqual(scroll.vw);
  expect(scroll.h).toBeLessThanOrEqual(scroll.vh);
  const smallest = await page.evaluate(() => {
    let min = Infinity;
    for (const tile of document.querySelectorAll('article[aria-label]'))
      for (const node of tile.querySelectorAll('*')) {
        const hasText = [...node.childNodes].some(
          (child) => child.nodeType === Node.TEXT_NODE && child.textContent?.trim(),
        );
        const style = getComputedStyle(node);
        if (hasText && style.visibility !== 'hidden' && style.display !== 'none')
          min = Math.min(min, parseFloat(style.fontSize));
      }
    return min;
  });
  expect(smallest * CAP_HEIGHT_EM).toBeGreaterThanOrEqual(minCapAt1080p * (height / 1080) - 0.5);
  expect(await flaws(page)).toEqual([]);
}

describe('wall board', () => {
  let server: RunningServer;
  let browser: BrowserContext;
  let owner: Api;
  beforeAll(async () => {
    server = await startServer();
    browser = await openBrowser({ width: 1920, height: 1080 });
    owner = await apiAs(server, 'owner@marlowcreek.test');
  });
  afterAll(async () => {
    await browser?.close();
    await server?.stop();
  });

  it.each([
    [8, 1920, 1080],
    [8, 3840, 2160],
    [24, 1920, 1080],
    [24, 3840, 2160],
  ])(
    'fits %i bays at %ix%i without scrolling, every tile text at legible size',
    async (bays, width, height) => {
      const existing = (await owner<BoardSnapshot>('GET', '/board')).bays.length;
      for (let n = existing + 1; n <= bays; n++) await owner('POST', '/bays', { name: `Bay ${n}` });
      const page = await browser.newPage();
      await page.setViewportSize({ width, height });
      await openWall(page, server);
      await page.waitForTimeout(500);
      await assertLegibleAndStill(page, height, bays <= 8 ? PREFERRED_CAP_AT_1080P : MIN_CAP_AT_1080P);
      await page.screenshot({ path: screenshotPath(`wall-${bays}-bays-${width}x${height}`) });
      await page.close();
    },
  );

  it('packs the people strip again when its chips grow with the same words, as when a font arrives', async () => {
    const page = await browser.newPage();
    await page.setViewportSize({ width: 1920, height: 1080 });
    // The strip stays on its first page while the clock stands still.
    await page.clock.install();
    // The chips start far narrower with the same words, as in a narrow fallback font, so the strip first
    // packs several to a page whoever is on shift and whatever their chips say.
    await page.addInitScript(() =>
      document.addEventListener('DOMContentLoaded', () => {
        const narrow = document.createElement('style');
        narrow.id = 'narrow-chips';
        narrow.textContent = '[class*="_chip_"] { max-width: 8rem; overflow: hidden; }';
        document.head.append(narrow);
      }),
    );
    await openWall(page, server);
    const shown = peopleStrip(page).locator('[class*="_chips_"] > [class*="_chip_"]');
    await expect.poll(() => shown.count()).toBeGreaterThan(1);
    const packed = await shown.count();
    await page.evaluate(() => document.getElementById('narrow-chips')?.remove());
    await expect.poll(() => shown.count()).toBeLessThan(packed);
    // More pages need more page marks, which leaves the chips less room: the strip packs again a frame later.
    await expect.poll(() => flaws(page)).toEqual([]);
    await page.close();
  });

  it('recovers to the true state by itself after the server is killed and restarted, without a reload', async () => {
    const page = await browser.newPage();
    await openWall(page, server);
    await page.evaluate(() => ((window as unknown as { notReloaded: boolean }).notReloaded = true));

    await server.kill('SIGKILL');
    await page.getByText(/offline since/i).waitFor({ timeout: 20_000 });
    await page.screenshot({ path: screenshotPath('wall-link-lost') });
    await server.restart();

    // A change made while the board was away must show once it reconnects.
    owner = await apiAs(server, 'owner@marlowcreek.test');
    const sam = (await owner<UserDto[]>('GET', '/users')).find((u) => u.name === 'Sam Ortega')!;
    await owner('POST', '/punches', { id: randomUUID(), kind: 'shift-out', technicianId: sam.id });
    const truth = await owner<BoardSnapshot>('GET', '/board');
    await expect.poll(() => peopleStrip(page).textContent(), { timeout: 30_000 }).not.toContain('Sam O.');
    for (const bay of truth.bays.slice(0, 8))
      await expect
        .poll(() => bayTile(page, bay.name).textContent(), { timeout: 5000 })
        .toMatch(new RegExp(BAY_STATE_WORDS[bay.state], 'i'));
    await expect.poll(() => page.getByText(/offline since/i).count()).toBe(0);
    expect(await page.evaluate(() => (window as unknown as { notReloaded?: boolean }).notReloaded)).toBe(
      true,
    );
  });

  it('gives forty people on shift pages of their own among the bays, everyone at legible size', async () => {
    // Whoever of the demo's six is on shift, and as many more as make forty, each shifted in as at a kiosk.
    const firsts = ['Arlo', 'Bette', 'Cass', 'Dov', 'Edda', 'Fenn', 'Greer', 'Hale', 'Ines', 'Jory', 'Kit'];
    const shiftIn = async (n: number) => {
      const badge = String(3000 + n);
      await owner('POST', '/users', {
        name: `${firsts[n % firsts.length]} Wendle${String.fromCharCode(64 + n)}`,
        role: 'technician',
        badge,
        pin: '4321',
      });
      const { token } = await technicianDay(server, badge);
      const punch = await fetch(`${server.url}/api/punches`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
        body: JSON.stringify({ id: randomUUID(), kind: 'shift-in' }),
      });
      expect(punch.status).toBe(201);
    };
    const already = (await owner<BoardSnapshot>('GET', '/board')).people.length;
    await Promise.all(Array.from({ length: 40 - already }, (_, i) => shiftIn(i + 1)));
    const onShift = (await owner<BoardSnapshot>('GET', '/board')).people.length;
    expect(onShift).toBe(40);

    const page = await browser.newPage();
    await page.setViewportSize({ width: 1920, height: 1080 });
    // The wall turns a page every 15 s of its clock: the test moves the clock instead of waiting.
    await page.clock.install();
    // Bay 1 is not on the screen while a people's page is: wait for the board, whichever page it shows.
    await page.goto(`${server.url}/wall?code=${await pairingCode(server)}`);
    await page.locator('main[aria-label$=" board"]').waitFor({ timeout: 50_000 });
    // Once the strip has counted its turns, the people's pages are among the pages.
    await expect.poll(() => peopleStrip(page).textContent()).toMatch(/\d+\/\d+/);
    const pageMark = page.getByLabel(/^Page \d+ of/);
    const [first, pages] = (await pageMark.getAttribute('aria-label'))!.match(/\d+/g)!.map(Number) as [
      number,
      number,
    ];
    const people = page.locator('section[aria-label="People on shift"]');
    // With pages of their own, the strip shows only those off jobs: the others are on their bays' tiles.
    const onJobs = (await owner<BoardSnapshot>('GET', '/board')).people
      .filter((person) => person.status === 'on-job')
      .map((person) => person.name);
    expect(onJobs.length).toBeGreaterThan(0);
    const stripNames = peopleStrip(page).locator(
      '[class*="_chips_"] > [class*="_chip_"] [class*="chipName"]',
    );
    const inStrip = new Set<string>();
    const seen = new Set<string>();
    for (let turn = 0; turn < pages; turn++) {
      // The screen has turned to the next page before it is read.
      const shown = ((first - 1 + turn) % pages) + 1;
      await expect.poll(() => pageMark.getAttribute('aria-label')).toBe(`Page ${shown} of ${pages}`);
      expect(await flaws(page), `page ${shown} of ${pages}`).toEqual([]);
      if (await people.isVisible()) {
        expect(await people.locator('h2').textContent()).toMatch(new RegExp(`^${onShift} on shift`));
        for (const name of await people.locator('[class*="chipName"]').allTextContents()) seen.add(name);
        const smallest = await people.evaluate((section) =>
          Math.min(
            ...[...section.querySelectorAll('span, h2')].map((node) =>
              parseFloat(getComputedStyle(node).fontSize),
            ),
          ),
        );
        expect(smallest * CAP_HEIGHT_EM).toBeGreaterThanOrEqual(MIN_CAP_AT_1080P - 0.5);
        await page.screenshot({ path: screenshotPath(`wall-people-page-${shown}`) });
      }
      await page.clock.fastForward(15_000);
    }
    // Every short name on shift showed on one of the people's pages (some short names repeat).
    const names = new Set((await owner<BoardSnapshot>('GET', '/board')).people.map((person) => person.name));
    expect(seen).toEqual(names);
    // A round of the strip's turns, five seconds each, as its own page mark counts them, and one more.
    const stripMark = (await peopleStrip(page).textContent())?.match(/(\d+)\/(\d+)$/);
    for (let turn = 0; turn <= Number(stripMark?.[2] ?? 1); turn++) {
      for (const name of await stripNames.allTextContents()) inStrip.add(name);
      await page.clock.fastForward(5_000);
    }
    expect(inStrip.size).toBeGreaterThan(0);
    expect(onJobs.filter((name) => inStrip.has(name))).toEqual([]);
    await page.close();
  });
});
