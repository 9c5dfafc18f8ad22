import { createHmac, randomBytes } from 'node:crypto';
import type { BrowserContext, Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { SignInAnswer } from '@baytime/shared';
import { openBrowser, screenshotPath } from './support/browser.js';
import { signInAtOffice } from './support/floor.js';
import { startServer, type RunningServer } from './support/server.js';

// 49 CFR 565.15 worked example: check digit X; model year code K.
const VIN = '1M8GDM9AXKP042788';
const ADVISOR = 'advisor@marlowcreek.test';
const TOKEN_KEY = 'baytime.office.token';
const HOUR_S = 3600;
const JWT_SECRET = randomBytes(32).toString('hex');

/** An office token as the server signs them (HS256), with the times given in seconds. */
function officeToken(claims: { sub: number; role: string; iat: number; exp: number; signedInAt: number }) {
  const part = (value: object) => Buffer.from(JSON.stringify(value)).toString('base64url');
  const unsigned = `${part({ alg: 'HS256', typ: 'JWT' })}.${part(claims)}`;
  return `${unsigned}.${createHmac('sha256', JWT_SECRET).update(unsigned).digest('base64url')}`;
}

const expiryOf = (token: string) =>
  (JSON.parse(Buffer.from(token.split('.')[1]!, 'base64url').toString()) as { exp: number }).exp;

describe('the office sign-in', () => {
  let server: RunningServer;
  /** One browser each test: a browser holds one office sign-in. */
  const browsers: BrowserContext[] = [];
  let advisorId: number;
  const newOfficePage = async () => {
    const browser = await openBrowser({ width: 1600, height: 1000 });
    browsers.push(browser);
    return browser.newPage();
  };
  beforeAll(async () => {
    server = await startServer({ JWT_SECRET });
    const login = await fetch(`${server.url}/api/auth/login`, {
      method: 'POST',
      headers: { 'content-type': 'application/json' },
      body: JSON.stringify({ email: ADVISOR, password: 'baytime-demo' }),
    });
    advisorId = ((await login.json()) as SignInAnswer).user.id;
  });
  afterAll(async () => {
    for (const browser of browsers) await browser.close();
    await server?.stop();
  });

  const storedToken = (page: Page) => page.evaluate((key) => localStorage.getItem(key), TOKEN_KEY);

  it('renews itself while in use in the last third of its life', async () => {
    const page = await newOfficePage();
    const now = Math.floor(Date.now() / 1000);
    const ageing = officeToken({
      sub: advisorId,
      role: 'advisor',
      iat: now - 9 * HOUR_S,
      exp: now + 3 * HOUR_S,
      signedInAt: now - 9 * HOUR_S,
    });
    await page.goto(`${server.url}/sign-in`);
    await page.evaluate(([key, token]) => localStorage.setItem(key!, token!), [TOKEN_KEY, ageing]);
    const renewed = page.waitForResponse((response) => response.url().endsWith('/api/auth/renew'));
    await page.goto(`${server.url}/repair-orders`);
    expect((await renewed).status()).toBe(200);
    await expect.poll(() => storedToken(page)).not.toBe(ageing);
    expect(expiryOf((await storedToken(page))!)).toBeGreaterThan(now + 11 * HOUR_S);
    await page.getByRole('navigation', { name: 'Office' }).getByRole('link', { name: 'Dispatch' }).click();
    await page.waitForURL(/\/dispatch$/);
    expect(new URL(page.url()).pathname).toBe('/dispatch');
  });

  it('keeps a half-typed repair order through a sign-in that ran out, until it is cleared or written', async () => {
    const page = await newOfficePage();
    await signInAtOffice(page, server, ADVISOR);
    await page.goto(`${server.url}/repair-orders/new`);
    const name = page.getByLabel('Name');
    const concern = page.getByLabel('What the customer asked for');
    const line1 = page.getByRole('group', { name: 'Line 1' });
    await name.fill('Dana Whitfield');
    await concern.fill('Grinding from the front left when braking');
    await line1.getByPlaceholder(/Search the menu/).fill('Front brake pads');

    // The sign-in runs out mid-intake: the next request (the VIN's lookup) is refused.
    const now = Math.floor(Date.now() / 1000);
    const ranOut = officeToken({
      sub: advisorId,
      role: 'advisor',
      iat: now - 12 * HOUR_S - 60,
      exp: now - 60,
      signedInAt: now - 12 * HOUR_S - 60,
    });
    await page.evaluate(([key, token]) => localStorage.setItem(key!, token!), [TOKEN_KEY, ranOut]);
    await page.getByLabel('VIN').fill(VIN);
    await page.getByText('Sign in with your shop e-mail and password.').waitFor();

    await page.getByLabel('E-mail').fill(ADVISOR);
    await page.getByLabel('Password').fill('baytime-demo');
    await page.getByRole('button', { name: 'Sign in' }).click();
    await page.waitForURL(/\/repair-orders\/new$/);
    const restored = page.getByText('Restored what you were typing');
    await restored.waitFor();
    expect(await name.inputValue()).toBe('Dana Whitfield');
    expect(await concern.inputValue()).toBe('Grinding from the front left when braking');
    expect(await line1.getByPlaceholder(/Search the menu/).inputValue()).toBe('Front brake pads');
    expect(await page.getByLabel('VIN').inputValue()).toBe(VIN);
    await page.screenshot({ path: screenshotPath('intake-restored') });

    // A reload restores it too; clearing leaves an empty form, also after the next reload.
    await page.reload();
    await restored.waitFor();
    await page.getByRole('button', { name: 'Clear the form' }).click();
    await expect.poll(() => name.inputValue()).toBe('');
    expect(await restored.count()).toBe(0);
    await page.reload();
    await name.waitFor();
    expect(await name.inputValue()).toBe('');

    // Written: nothing is left to restore.
    await name.fill('Dana Whitfield');
    await page.getByLabel('VIN').fill(VIN);
    await page.getByLabel('Make').fill('Tarrow');
    await page.getByLabel(/^Model\s*\*?$/).fill('Kestrel');
    await page.getByLabel(/Odometer/).fill('88100');
    await concern.fill('Grinding from the front left when braking');
    await line1.getByPlaceholder(/Search the menu/).fill('Front brake pads');
    await line1.getByLabel('Book hours').fill('1.5');
    await page.getByRole('button', { name: 'Write repair order' }).click();
    await page.waitForURL(/\/repair-orders\/\d+$/);
    await page.goto(`${server.url}/repair-orders/new`);
    await name.waitFor();
    expect(await name.inputValue()).toBe('');
    expect(await restored.count()).toBe(0);
  });
});
