import { randomUUID } from 'node:crypto';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it, onTestFinished } from 'vitest';
import {
  BAY_STATE_WORDS,
  CONNECTION_WORDS,
  makeVin,
  type BoardSnapshot,
  type RepairOrderSummary,
  type UserDto,
} from '@baytime/shared';
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

  // Runs before the bays are added below: the sizes checked there then include this tile. The demo's
  // eight bays give each tile two lines of facts at 1920x1080: the long model once took both, and the
  // tile never showed its RO or its technician.
  it('cuts a long vehicle name on a staged bay to one line at 8 bays, at its model, so its RO and technician show', async () => {
    const model = 'Grand Voyager Extended Cab Heavy Duty 3500';
    const advisor = await apiAs(server, 'advisor@marlowcreek.test');
    const foreman = await apiAs(server, 'foreman@marlowcreek.test');
    const ro = await advisor<RepairOrderSummary>('POST', '/repair-orders', {
      customer: { name: 'Pat Lindqvist', phone: '(608) 555-0142' },
      vehicle: {
        vin: makeVin('1WK3500GKA123456'),
        year: 2019,
        make: 'Wolverhampton-Kesselring',
        model,
        odometer: 88_000,
      },
      concern: 'Knock from the front end over bumps',
      lines: [{ title: 'Replace front lower control arm bushings and align front end', bookHours: 2.5 }],
    });
    const board = await owner<BoardSnapshot>('GET', '/board');
    expect(board.bays).toHaveLength(8);
    const bay = board.bays.find((b) => b.state === 'free')!;
    const jo = (await owner<UserDto[]>('GET', '/users')).find((u) => u.name === 'Jo Whitfield')!;
    await foreman('PATCH', `/job-lines/${ro.lines[0]!.id}`, { technicianId: jo.id, bayId: bay.id });

    const page = await browser.newPage();
    await page.setViewportSize({ width: 1920, height: 1080 });
    await openWall(page, server);
    const tile = bayTile(page, bay.name);
    await expect.poll(() => tile.textContent(), { timeout: 5000 }).toContain(model);
    const vehicle = tile.locator('[data-shortened]', { hasText: model });
    // Make and model in that order, without the year, so the ellipsis at the end of the line cuts the model.
    expect(await vehicle.textContent()).toBe(`Wolverhampton-Kesselring ${model}`);
    const shown = await vehicle.evaluate((line, firstWord) => {
      const box = line.getBoundingClientRect();
      const word = document.createRange();
      word.setStart(line.firstChild!, 0);
      word.setEnd(line.firstChild!, firstWord.length);
      return {
        cut: line.scrollWidth > line.clientWidth + 1,
        lines: Math.round(box.height / parseFloat(getComputedStyle(line).lineHeight)),
        firstWordInside: [...word.getClientRects()].every(
          (rect) => rect.bottom <= box.bottom + 1 && rect.right <= box.right + 1,
        ),
      };
    }, '2019');
    expect(shown).toEqual({ cut: true, lines: 1, firstWordInside: true });
    // The line under the vehicle takes the RO and the technician in turn (every 5 s), each inside the tile.
    const tileBox = (await tile.boundingBox())!;
    for (const text of [`RO ${ro.number}`, 'Jo W.']) {
      const fact = tile.getByText(text, { exact: true });
      await fact.waitFor({ timeout: 15_000 });
      const box = (await fact.boundingBox())!;
      expect(box.y + box.height, text).toBeLessThanOrEqual(tileBox.y + tileBox.height);
      expect(await vehicle.isVisible(), 'the vehicle stays').toBe(true);
    }
    await assertLegibleAndStill(page, 1080, PREFERRED_CAP_AT_1080P);
    await page.screenshot({ path: screenshotPath('wall-long-model') });
    await page.close();
  });

  /** A warm-up on two readings: an estimate on thin evidence, which the wall shows as "about". */
  async function roughWarmUp(): Promise<{ bayName: string; stop: () => Promise<void> }> {
    const { token, day } = await technicianDay(server, '1041');
    const line = day.lines.find((each) => each.bayName !== null)!;
    const as = (path: string, body: object) =>
      fetch(`${server.url}/api${path}`, {
        method: 'POST',
        headers: { 'content-type': 'application/json', authorization: `Bearer ${token}` },
        body: JSON.stringify(body),
      }).then(async (response) => {
        expect(response.ok, await response.clone().text()).toBe(true);
        return (await response.json()) as { id: number };
      });
    const timer = await as('/timers', {
      jobLineId: line.id,
      kind: 'warm-up',
      targetC: 45,
      cautionAcknowledged: true,
    });
    await as(`/timers/${timer.id}/readings`, { tempC: 30, at: new Date(Date.now() - 50_000).toISOString() });
    await as(`/timers/${timer.id}/readings`, { tempC: 34 });
    return {
      bayName: line.bayName!,
      stop: async () => {
        await as(`/timers/${timer.id}/stop`, {});
      },
    };
  }

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
      const warmUp = await roughWarmUp();
      onTestFinished(() => warmUp.stop());
      await openWall(page, server);
      await page.waitForTimeout(500);
      // The countdown is the one fact a timer tile is there for: "about 3:43 left" once showed "about 3…".
      const countdown = bayTile(page, warmUp.bayName)
        .locator('span', { hasText: /\d:\d\d/ })
        .first();
      await countdown.waitFor({ timeout: 5000 });
      expect(
        await countdown.evaluate((line) => ({
          figures: /\d+:\d\d/.test(line.textContent ?? ''),
          cut: line.scrollWidth > line.clientWidth + 1,
          shortened: line.hasAttribute('data-shortened'),
        })),
      ).toEqual({ figures: true, cut: false, shortened: false });
      await assertLegibleAndStill(page, height, bays <= 8 ? PREFERRED_CAP_AT_1080P : MIN_CAP_AT_1080P);
      await page.screenshot({ path: screenshotPath(`wall-${bays}-bays-${width}x${height}`) });
      await page.close();
    },
  );

  it('packs the people strip again when its chips grow with the same words, as when a font arrives', async () => {
    const page = await browser.newPage();
    await page.setViewportSize({ width: 1920, height: 1080 });
    // clock.install() fakes the page's clock but does not stop it: it runs on in real time, and the strip
    // still turns every 5 s.
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
    // The wall turns a page every 15 s of its clock and the strip every 5 s: the test moves the clock
    // instead of waiting. clock.install() fakes the clock but does not stop it (it runs on in real time),
    // so the clock is paused once the board is up, and each move is read off the screen, never foretold.
    await page.clock.install();
    // Bay 1 is not on the screen while a people's page is: wait for the board, whichever page it shows.
    await page.goto(`${server.url}/wall?code=${await pairingCode(server)}`);
    await page.locator('main[aria-label$=" board"]').waitFor({ timeout: 50_000 });
    await page.clock.pauseAt((await page.evaluate(() => Date.now())) + 1_000);
    // A move runs only its last second of timers, which the board's own second tick needs to show the
    // new time. The live link's ping timeout is a timer too, and a few dozen moves may run it out: the
    // link then drops, and comes back by itself (on a timer as well) before the clock moves on.
    const online = page.locator('header').getByText(CONNECTION_WORDS.online, { exact: true });
    // Tells whether the link had dropped: its snapshot then set the board's clock to the server's again.
    const moveClock = async (ms: number) => {
      let wait = 0;
      for (; !(await online.isVisible()); wait++) {
        expect(wait, 'the live link is back').toBeLessThan(100);
        await page.clock.fastForward(200);
        await new Promise((resolve) => setTimeout(resolve, 50));
      }
      await page.clock.setSystemTime((await page.evaluate(() => Date.now())) + ms - 1_000);
      await page.clock.fastForward(1_000);
      return { linkDropped: wait > 0 };
    };
    // Once the strip has counted its turns, the people's pages are among the pages.
    await expect.poll(() => peopleStrip(page).textContent()).toMatch(/\d+\/\d+/);
    const pageMark = page.getByLabel(/^Page \d+ of/);
    const pageLabel = async () => (await pageMark.getAttribute('aria-label')) ?? '';
    const pages = Number(/^Page \d+ of (\d+)$/.exec(await pageLabel())?.[1]);
    expect(pages).toBeGreaterThan(1);
    const people = page.locator('section[aria-label="People on shift"]');
    // With pages of their own, the strip shows only those off jobs: the others are on their bays' tiles.
    const onJobs = (await owner<BoardSnapshot>('GET', '/board')).people
      .filter((person) => person.status === 'on-job')
      .map((person) => person.name);
    expect(onJobs.length).toBeGreaterThan(0);

    // What the screen shows, read again should the page change meanwhile (a snapshot after a reconnect
    // sets the board's clock to the server's again).
    const readScreen = async () => {
      for (;;) {
        const label = await pageLabel();
        const found = await flaws(page);
        const peoplePage = await people.evaluateAll((sections) =>
          sections.map((section) => ({
            heading: section.querySelector('h2')?.textContent ?? '',
            names: [...section.querySelectorAll('[class*="chipName"]')].map((name) => name.textContent ?? ''),
            smallest: Math.min(
              ...[...section.querySelectorAll('span, h2')].map((node) =>
                parseFloat(getComputedStyle(node).fontSize),
              ),
            ),
          })),
        );
        const shown = Number(/^Page (\d+)/.exec(label)?.[1]);
        if (peoplePage.length) await page.screenshot({ path: screenshotPath(`wall-people-page-${shown}`) });
        if ((await pageLabel()) === label) return { label, shown, flaws: found, people: peoplePage[0] };
      }
    };
    // A page at a time until every page has shown, allowing for a few rounds.
    const shownPages = new Set<number>();
    const seen = new Set<string>();
    for (let turn = 0; turn < 3 * pages; turn++) {
      const screen = await readScreen();
      shownPages.add(screen.shown);
      expect(screen.flaws, screen.label).toEqual([]);
      if (screen.people) {
        expect(screen.people.heading).toMatch(new RegExp(`^${onShift} on shift`));
        for (const name of screen.people.names) seen.add(name);
        expect(screen.people.smallest * CAP_HEIGHT_EM).toBeGreaterThanOrEqual(MIN_CAP_AT_1080P - 0.5);
      }
      if (shownPages.size === pages) break;
      await moveClock(15_000);
      await expect.poll(pageLabel, { timeout: 5_000 }).not.toBe(screen.label);
    }
    expect([...shownPages].sort((a, b) => a - b)).toEqual(Array.from({ length: pages }, (_, i) => i + 1));
    // Every short name on shift showed on one of the people's pages (some short names repeat).
    const names = new Set((await owner<BoardSnapshot>('GET', '/board')).people.map((person) => person.name));
    expect(seen).toEqual(names);

    // The strip's turns in the same way, five seconds each, until each of its pages has shown. Its idle
    // times grow with the clock meanwhile ("<1m", "4m", "12m"), yet the same people make the same count of
    // pages, and each turn shows the next one (but after a dropped link, which resets the board's clock).
    const readStrip = () =>
      peopleStrip(page).evaluate((strip) => ({
        mark: /\d+\/\d+$/.exec(strip.querySelector('[class*="_stripPages_"]')?.textContent ?? '')?.[0] ?? '',
        names: [...strip.querySelectorAll('[class*="_chips_"] > [class*="_chip_"] [class*="chipName"]')].map(
          (name) => name.textContent ?? '',
        ),
      }));
    let strip = await readStrip();
    const [firstShown, stripPages] = strip.mark.split('/').map(Number) as [number, number];
    expect(stripPages).toBeGreaterThan(1);
    const inStrip = new Set<string>();
    const stripShown = new Set<number>();
    let shownNow = firstShown;
    for (let turn = 0; ; turn++) {
      expect(strip.mark, `turn ${turn}`).toBe(`${shownNow}/${stripPages}`);
      for (const name of strip.names) inStrip.add(name);
      stripShown.add(shownNow);
      if (stripShown.size === stripPages) break;
      expect(turn, `strip pages shown: ${[...stripShown].join(', ')}`).toBeLessThan(3 * stripPages);
      const { linkDropped } = await moveClock(5_000);
      if (linkDropped) {
        // Any page may show after the board's clock is set again: the count is still checked above.
        await new Promise((resolve) => setTimeout(resolve, 500));
        strip = await readStrip();
        shownNow = Number(strip.mark.split('/')[0]);
      } else {
        shownNow = (shownNow % stripPages) + 1;
        await expect
          .poll(async () => (strip = await readStrip()).mark, { timeout: 5_000 })
          .toBe(`${shownNow}/${stripPages}`);
      }
    }
    // One round of the strip shows everyone off a job, and nobody on one.
    const offJobs = (await owner<BoardSnapshot>('GET', '/board')).people
      .filter((person) => person.status !== 'on-job')
      .map((person) => person.name);
    expect(inStrip).toEqual(new Set(offJobs));
    expect(onJobs.filter((name) => inStrip.has(name))).toEqual([]);
    await page.close();
  });
});
