import { AxeBuilder } from '@axe-core/playwright';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { OFFICE_NAV } from '../board/src/config/office-nav';
import { paths } from '../board/src/config/paths';
import { openBrowser } from './support/browser.js';
import type { ApprovalRequested } from '@baytime/shared';
import {
  apiAs,
  offlineSheetFetched,
  openKiosk,
  openWall,
  recordFinding,
  signInAtOffice,
  technicianDay,
} from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

/** WCAG 2.0, 2.1 and 2.2, levels A and AA, as axe-core tags its rules. */
const WCAG_TAGS = ['wcag2a', 'wcag2aa', 'wcag21a', 'wcag21aa', 'wcag22a', 'wcag22aa'];

interface AcceptedException {
  rule: string;
  /** A CSS selector the flagged element itself matches. */
  element: string;
  why: string;
}

/** Violations we accept, each with its reason. Anything else fails the test. */
const ACCEPTED: readonly AcceptedException[] = [
  {
    rule: 'aria-hidden-focus',
    element: 'i[data-tabster-dummy]',
    why:
      'Fluent UI v9 keyboard handling (tabster) puts a focusable, aria-hidden <i> before and after ' +
      'a TabList (arrow-key group) and, once a Dialog is mounted, around the page body. Each one ' +
      'hands the focus on the moment it arrives, and is hidden so screen readers do not announce ' +
      'it. The Fluent and tabster maintainers call it by design (microsoft/fluentui#27517, ' +
      'microsoft/tabster#288).',
  },
];

/**
 * Runs axe on the page as it is now, or only on the part `within` selects, and returns what no
 * accepted exception covers.
 */
async function checkPage(
  page: Page,
  where: string,
  seen: Set<AcceptedException>,
  within?: string,
): Promise<string[]> {
  // A popover or dialog fading in has colours axe cannot judge yet: let finite animations end.
  await page.evaluate(() =>
    Promise.all(
      document
        .getAnimations()
        .filter((animation) => animation.effect?.getComputedTiming().iterations !== Infinity)
        .map((animation) => animation.finished.catch(() => undefined)),
    ),
  );
  const builder = new AxeBuilder({ page }).withTags(WCAG_TAGS);
  if (within) builder.include(within);
  const { violations } = await builder.analyze();
  const findings: string[] = [];
  for (const violation of violations)
    for (const node of violation.nodes) {
      const target = node.target.join(' ');
      const accepted = await acceptedFor(page, violation.id, target);
      if (accepted) {
        seen.add(accepted);
        continue;
      }
      findings.push(
        `${where}: ${violation.id} (${violation.impact}) at ${target}: ${node.html.slice(0, 160)}`,
      );
    }
  return findings;
}

async function acceptedFor(page: Page, rule: string, target: string) {
  for (const exception of ACCEPTED) {
    if (exception.rule !== rule) continue;
    const matches = await page.evaluate(
      ([selector, pattern]) => document.querySelector(selector)?.matches(pattern) ?? false,
      [target, exception.element] as const,
    );
    if (matches) return exception;
  }
  return undefined;
}

/**
 * Tabs through the page once and names each stop that looks the same focused and not: its outline,
 * shadow, border, background, text decoration and transform, of its ::before and ::after, and of
 * its parent and grandparent, where Fluent draws some rings. Stops at the first stop seen again.
 */
async function stopsWithoutFocusRing(page: Page): Promise<string[]> {
  await page.evaluate(() => {
    const props = [
      'outline-style',
      'outline-width',
      'outline-color',
      'box-shadow',
      'border-top-color',
      'border-bottom-color',
      'border-bottom-width',
      'background-color',
      'text-decoration-line',
      'text-decoration-style',
      'transform',
    ];
    const look = (element: Element) => {
      const parts: string[] = [];
      for (let e: Element | null = element, up = 0; e && up < 3; e = e.parentElement, up++)
        for (const pseudo of [null, '::before', '::after']) {
          const style = getComputedStyle(e, pseudo);
          parts.push(props.map((prop) => style.getPropertyValue(prop)).join('|'));
        }
      return parts.join('#');
    };
    const stops: { element: Element; name: string; focusedLook: string }[] = [];
    Object.assign(window, {
      nextTabStop: () => {
        const element = document.activeElement;
        const last = stops.at(-1);
        if (!element || element === last?.element) return { done: false, missing: null };
        const missing = last && look(last.element) === last.focusedLook ? last.name : null;
        if (element === document.body || stops.some((stop) => stop.element === element))
          return { done: true, missing };
        const name = `${element.tagName.toLowerCase()} "${(element.getAttribute('aria-label') ?? element.textContent ?? '').trim().slice(0, 40)}"`;
        stops.push({ element, name, focusedLook: look(element) });
        return { done: false, missing };
      },
    });
  });
  const missing: string[] = [];
  for (let press = 0; press < 400; press++) {
    await page.keyboard.press('Tab');
    const step = await page.evaluate(() =>
      (window as unknown as { nextTabStop: () => { done: boolean; missing: string | null } }).nextTabStop(),
    );
    if (step.missing) missing.push(step.missing);
    if (step.done) return missing;
  }
  throw new Error('the tab order never came back round');
}

describe('accessibility: WCAG 2.2 A and AA on every screen', () => {
  let server: RunningServer;
  const browsers: BrowserContext[] = [];
  const seen = new Set<AcceptedException>();
  /** A page in a browser of its own: no sign-in carries over from another test. */
  const freshPage = async (viewport: { width: number; height: number }) => {
    const browser = await openBrowser(viewport);
    browsers.push(browser);
    return browser.newPage();
  };
  beforeAll(async () => {
    server = await startServer();
  });
  afterAll(async () => {
    for (const browser of browsers) await browser.close();
    await server?.stop();
  });

  it('office: every page, as the owner', async () => {
    const page = await freshPage({ width: 1600, height: 1000 });
    await page.goto(`${server.url}${paths.signIn}`);
    await page.getByRole('button', { name: 'Sign in' }).waitFor();
    const findings = await checkPage(page, 'sign-in', seen);

    await signInAtOffice(page, server, 'owner@marlowcreek.test');
    await page.goto(`${server.url}${paths.repairOrders}`);
    const firstOrder = page.locator('main a[href^="/repair-orders/"]:not([href$="/new"])').first();
    const orderPath = await firstOrder.getAttribute('href');
    const routes = [
      ...OFFICE_NAV.flatMap((group) => group.entries.map((entry) => entry.path)),
      paths.repairOrderNew,
      orderPath!,
      '/no-such-page',
    ];
    for (const route of routes) {
      await page.goto(`${server.url}${route}`);
      await page.locator('main h1').first().waitFor();
      await page.waitForLoadState('networkidle');
      findings.push(...(await checkPage(page, route, seen)));
    }

    // Open states: a refused form, a dialog, the keyboard Move menu (only the menu: the page
    // behind it is partly covered while it is open).
    await page.goto(`${server.url}${paths.repairOrderNew}`);
    await page.getByRole('button', { name: 'Write repair order' }).click();
    await page.locator('[aria-invalid="true"]').first().waitFor();
    findings.push(...(await checkPage(page, 'repair order intake, refused', seen)));
    await page.goto(`${server.url}${paths.timecards}`);
    await page
      .getByRole('button', { name: /^Correct / })
      .first()
      .click();
    await page.getByRole('dialog').waitFor();
    findings.push(...(await checkPage(page, 'timecard correction dialog', seen)));
    await page.goto(`${server.url}${paths.admin.users}`);
    await page
      .getByRole('button', { name: /^Edit / })
      .first()
      .click();
    await page.getByRole('dialog').waitFor();
    findings.push(...(await checkPage(page, 'edit person dialog', seen)));
    await page.keyboard.press('Escape');
    await page.goto(`${server.url}${paths.admin.screens}`);
    await page
      .getByRole('button', { name: /^Revoke / })
      .first()
      .click();
    await page.getByRole('dialog').waitFor();
    findings.push(...(await checkPage(page, 'revoke screen dialog', seen)));
    await page.goto(`${server.url}${paths.dispatch}`);
    await page
      .getByRole('button', { name: /^Parts for / })
      .first()
      .click();
    await page.getByRole('dialog').waitFor();
    findings.push(...(await checkPage(page, 'parts dialog', seen)));
    await page.keyboard.press('Escape');
    await page.getByRole('dialog').waitFor({ state: 'detached' });
    await page
      .getByRole('button', { name: /^Move line/ })
      .first()
      .focus();
    await page.keyboard.press('Enter');
    await page.getByRole('menu').waitFor();
    findings.push(...(await checkPage(page, 'dispatch Move menu', seen, '[role="menu"]')));
    await page.keyboard.press('Escape');

    // An RO whose work is done: the end of the visit, and the dialogs that edit it after the fact.
    await page.goto(`${server.url}${paths.repairOrders}?status=done`);
    await page.locator('main a[href^="/repair-orders/"]:not([href$="/new"])').first().click();
    await page.getByRole('group', { name: 'End of the visit' }).waitFor();
    await page.waitForLoadState('networkidle');
    findings.push(...(await checkPage(page, 'repair order, work done', seen)));
    for (const [button, where] of [
      ['Edit details', 'edit repair order dialog'],
      ['Edit', 'edit job line dialog'],
      ['Add a job line', 'add job line dialog'],
    ] as const) {
      await page.getByRole('button', { name: button, exact: true }).first().click();
      await page.getByRole('dialog').waitFor();
      findings.push(...(await checkPage(page, where, seen)));
      await page.keyboard.press('Escape');
      await page.getByRole('dialog').waitFor({ state: 'detached' });
    }
    expect(findings).toEqual([]);
  }, 180_000);

  it('office: every tab stop on every page shows a focus ring', async () => {
    const page = await freshPage({ width: 1600, height: 1000 });
    await signInAtOffice(page, server, 'owner@marlowcreek.test');
    const missing: string[] = [];
    for (const route of OFFICE_NAV.flatMap((group) => group.entries.map((entry) => entry.path))) {
      await page.goto(`${server.url}${route}`);
      await page.locator('main h1').first().waitFor();
      await page.waitForLoadState('networkidle');
      for (const stop of await stopsWithoutFocusRing(page)) missing.push(`${route}: ${stop}`);
    }
    expect(missing).toEqual([]);
  }, 180_000);

  it('kiosk: sign-in typed on a keyboard, my day, every sheet, my week', async () => {
    const page = await freshPage({ width: 1280, height: 800 });
    await page.goto(`${server.url}${paths.kiosk}`);
    await page.getByText('Pair this tablet').waitFor();
    const findings = await checkPage(page, 'kiosk pairing', seen);
    await page.getByLabel('Pairing code').fill('ZZZZZZ');
    await page.getByRole('button', { name: /^Pair/ }).click();
    await page.getByText(/unknown or has expired/).waitFor();
    findings.push(...(await checkPage(page, 'kiosk pairing refused', seen)));
    await openKiosk(page, server);
    findings.push(...(await checkPage(page, 'kiosk badge step', seen)));

    // No link: badge and PIN lead to the offline punch sheet.
    await offlineSheetFetched(page);
    await page.context().setOffline(true);
    await page.keyboard.type('1046');
    await page.keyboard.press('Enter');
    await page.getByText('PIN for badge 1046').waitFor();
    await page.keyboard.type('4321');
    await page.keyboard.press('Enter');
    await page.getByRole('dialog', { name: /record a punch offline/ }).waitFor();
    findings.push(...(await checkPage(page, 'kiosk offline punch sheet', seen)));
    await page.keyboard.press('Escape');
    await page.getByRole('dialog').waitFor({ state: 'detached' });
    await page.context().setOffline(false);

    // A badge reader or keyboard: digits, a slip corrected with Backspace, Enter; then the PIN.
    await page.keyboard.type('10419');
    await page.keyboard.press('Backspace');
    await page.keyboard.press('Enter');
    await page.getByText('PIN for badge 1041').waitFor();
    findings.push(...(await checkPage(page, 'kiosk PIN step', seen)));
    await page.keyboard.type('4321');
    await page.keyboard.press('Enter');
    await page.getByRole('list', { name: 'My job lines' }).waitFor();
    findings.push(...(await checkPage(page, 'kiosk my day', seen)));

    const line = page.locator('article', { has: page.getByRole('button', { name: 'Clock off' }) }).first();
    const sheet = page.getByRole('dialog');
    const checkSheet = async (where: string) => {
      await sheet.waitFor();
      findings.push(...(await checkPage(page, `kiosk ${where}`, seen)));
    };
    const leaveSheet = async () => {
      await page.keyboard.press('Escape');
      await sheet.waitFor({ state: 'detached' });
    };

    await line.getByRole('button', { name: 'Hold' }).click();
    await checkSheet('hold sheet');
    await sheet.getByRole('button', { name: /Waiting for parts/ }).click();
    await sheet.getByLabel(/Which part is needed/).waitFor();
    await checkSheet('hold sheet, which part');
    await page.keyboard.press('Escape');
    await sheet.getByRole('button', { name: /Waiting for parts/ }).waitFor();
    await leaveSheet();
    await line.getByRole('button', { name: 'Done' }).click();
    await checkSheet('done sheet');
    await leaveSheet();

    await line.getByRole('button', { name: 'Add finding' }).click();
    await checkSheet('finding sheet');
    await sheet.getByRole('button', { name: 'Send finding' }).click();
    await sheet.getByRole('alert').first().waitFor();
    await checkSheet('finding sheet with problems');
    await sheet.getByLabel('What did you find?').fill('Torn boot on the inner tie rod end');
    await sheet.getByRole('radio', { name: 'Watch' }).click();
    await sheet.getByRole('button', { name: 'Send finding' }).click();
    await sheet.getByText('The advisor has it').waitFor();
    await checkSheet('finding sent sheet');
    await sheet.getByRole('button', { name: 'OK' }).click();
    await sheet.waitFor({ state: 'detached' });

    await line.getByRole('button', { name: 'Start timer' }).click();
    await checkSheet('timer kind sheet');
    await sheet.getByRole('button', { name: /^Set time/ }).click();
    await checkSheet('set time sheet');
    await sheet.getByRole('button', { name: 'Back' }).click();
    await sheet.getByRole('button', { name: /Warm-up to a temperature/ }).click();
    await checkSheet('timer safety sheet');
    await sheet.getByRole('button', { name: /All checked/ }).click();
    await checkSheet('timer temperatures sheet');
    await page.keyboard.type('45');
    await sheet.getByRole('button', { name: /Start warm-up/ }).click();
    await sheet.waitFor({ state: 'detached' });
    await line.getByRole('button', { name: /Log reading/ }).click();
    await checkSheet('reading sheet');
    // Enter on a focused sheet button is that button's: Tab to Cancel, Enter cancels, nothing saved.
    await page.keyboard.type('30');
    await page.keyboard.press('Tab');
    await sheet.getByRole('button', { name: 'Cancel' }).and(page.locator(':focus')).waitFor();
    await page.keyboard.press('Enter');
    await sheet.waitFor({ state: 'detached' });
    await line.getByRole('button', { name: /Log reading/ }).click();
    await sheet.getByText(/first reading/).waitFor();
    // Anywhere else, digits and Enter type and send the reading.
    await page.keyboard.type('30');
    await page.keyboard.press('Enter');
    await sheet.waitFor({ state: 'detached' });
    await line.getByRole('button', { name: /Log reading/ }).click();
    await sheet.getByText(/last reading 30/).waitFor();
    await leaveSheet();
    findings.push(...(await checkPage(page, 'kiosk my day with a timer', seen)));
    // A meal break with a timer running asks about the timer first.
    await page.getByRole('button', { name: 'Break start · meal' }).click();
    await checkSheet('meal break with a running timer sheet');
    await leaveSheet();
    for (const stop of await stopsWithoutFocusRing(page))
      findings.push(`kiosk my day: no focus ring on ${stop}`);

    await page.getByRole('link', { name: 'My week' }).click();
    await page.waitForURL(/\/kiosk\/week/);
    await page.waitForLoadState('networkidle');
    findings.push(...(await checkPage(page, 'kiosk my week', seen)));
    for (const stop of await stopsWithoutFocusRing(page))
      findings.push(`kiosk my week: no focus ring on ${stop}`);
    expect(findings).toEqual([]);
  }, 120_000);

  it('wall: pairing form and board', async () => {
    const page = await freshPage({ width: 1920, height: 1080 });
    // The wall turns a tile's lines every few seconds with a fade that axe could catch half-way: the
    // fade is left out where less motion is asked for.
    await page.emulateMedia({ reducedMotion: 'reduce' });
    await page.goto(`${server.url}${paths.wall}`);
    await page.getByRole('button', { name: /pair/i }).waitFor();
    const findings = await checkPage(page, 'wall pairing form', seen);
    await openWall(page, server);
    findings.push(...(await checkPage(page, 'wall board', seen)));
    expect(findings).toEqual([]);
  });

  it('customer approval page on a phone, and the advisor’s wording dialog', async () => {
    const { token, day } = await technicianDay(server, '1043');
    const finding = await recordFinding(server, token, day.lines[0]!.id, {
      note: 'Front brake pads at 2 mm',
      severity: 'safety-now',
    });

    const office = await freshPage({ width: 1600, height: 1000 });
    await signInAtOffice(office, server, 'advisor@marlowcreek.test');
    await office.goto(`${server.url}${paths.findings}`);
    await office
      .locator('li', { hasText: 'Front brake pads at 2 mm' })
      .getByRole('button', { name: 'Review for the customer…' })
      .click();
    await office.getByRole('dialog').waitFor();
    const findings = await checkPage(office, 'finding wording dialog', seen);

    const advisor = await apiAs(server, 'advisor@marlowcreek.test');
    await advisor('PATCH', `/findings/${finding.id}/quote`, {
      customerWording: 'The front brake pads are worn down to 2 mm',
      bookHours: 1.2,
      partsCents: 64_00,
    });
    const sent = await advisor<ApprovalRequested>('POST', `/findings/${finding.id}/request-approval`);
    const page = await freshPage({ width: 390, height: 844 });
    await page.goto(sent.approvalUrl);
    await page.getByRole('button', { name: 'Send my answer' }).waitFor();
    await page.waitForLoadState('networkidle');
    findings.push(...(await checkPage(page, 'customer approval page', seen)));
    await page.getByRole('button', { name: 'Send my answer' }).click();
    await page.locator('[aria-invalid="true"]').first().waitFor();
    findings.push(...(await checkPage(page, 'customer approval page, refused', seen)));
    for (const stop of await stopsWithoutFocusRing(page))
      findings.push(`customer approval page: no focus ring on ${stop}`);
    await advisor('POST', `/approval-links/${sent.link.id}/revoke`);
    await page.reload();
    await page.getByText('This link is closed').waitFor();
    findings.push(...(await checkPage(page, 'customer approval page, closed link', seen)));
    expect(findings).toEqual([]);
  }, 120_000);

  it('accepts only exceptions that still occur', () => {
    expect([...seen].map((exception) => exception.rule)).toEqual(ACCEPTED.map((exception) => exception.rule));
  });
});
