import type { FindingDto, MyDay } from '@baytime/shared';
import type { Page } from 'playwright-core';
import type { RunningServer } from './server.js';
import { kioskPairingCode, pairingCode } from './server.js';

/** Opens the kiosk, pairing the tablet first (once per browser) as the owner would with a code. */
export async function openKiosk(page: Page, server: RunningServer): Promise<void> {
  await page.goto(`${server.url}/kiosk/`);
  const keypad = page.getByText('Sign in with your badge');
  await keypad.or(page.getByText('Pair this tablet')).first().waitFor();
  if (await keypad.isVisible()) return;
  await page.goto(`${server.url}/kiosk/?code=${await kioskPairingCode(server)}`);
  await keypad.waitFor();
}

/** Waits until the kiosk has fetched its offline punch sheet, which it does once the keypad shows: once
 * offline, a tablet whose service worker is not yet in charge cannot fetch it. */
export async function offlineSheetFetched(page: Page): Promise<void> {
  await page.waitForFunction(() =>
    performance.getEntriesByType('resource').some((entry) => entry.name.includes('offline-punch-sheet')),
  );
}

/** Signs a technician in on the kiosk keypad the way a badge reader would: digits, then Enter. */
export async function signInAtKiosk(
  page: Page,
  server: RunningServer,
  badge: string,
  pin = '4321',
): Promise<void> {
  await openKiosk(page, server);
  await page.keyboard.type(badge);
  await page.keyboard.press('Enter');
  await page.getByText('Now your PIN').waitFor();
  await page.keyboard.type(pin);
  await page.keyboard.press('Enter');
  await page
    .getByRole('list', { name: 'My job lines' })
    .or(page.getByText('No job lines assigned'))
    .first()
    .waitFor();
}

/** Opens the wall board paired with a fresh code, and waits for the first snapshot. */
export async function openWall(page: Page, server: RunningServer): Promise<void> {
  await page.goto(`${server.url}/wall?code=${await pairingCode(server)}`);
  // A loaded machine can take a while to pair, connect and draw two dozen tiles.
  await page.locator('article[aria-label="Bay 1"]').waitFor({ timeout: 50_000 });
}

export const bayTile = (page: Page, name: string) => page.locator(`article[aria-label="${name}"]`);

/** The people strip holds every person in its text, also those on a later page of the strip. */
export const peopleStrip = (page: Page) => page.locator('footer');

export interface Api {
  <T>(method: string, path: string, body?: unknown): Promise<T>;
}

export async function apiAs(server: RunningServer, email: string): Promise<Api> {
  const login = await fetch(`${server.url}/api/auth/login`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email, password: 'baytime-demo' }),
  });
  const { accessToken } = (await login.json()) as { accessToken: string };
  return async <T>(method: string, path: string, body?: unknown): Promise<T> => {
    const response = await fetch(`${server.url}/api${path}`, {
      method,
      headers: { 'content-type': 'application/json', authorization: `Bearer ${accessToken}` },
      body: body === undefined ? undefined : JSON.stringify(body),
    });
    if (!response.ok) throw new Error(`${method} ${path}: ${response.status} ${await response.text()}`);
    return (await response.json()) as T;
  };
}

/** Signs in at the office sign-in page with a demo password; each browser context holds one sign-in. */
export async function signInAtOffice(page: Page, server: RunningServer, email: string): Promise<void> {
  await page.goto(`${server.url}/sign-in`);
  await page.getByLabel('E-mail').fill(email);
  await page.getByLabel('Password').fill('baytime-demo');
  await page.getByRole('button', { name: 'Sign in' }).click();
  await page.waitForURL((url) => !url.pathname.startsWith('/sign-in'));
}

/** A technician's token and day, as the kiosk gets them after a badge sign-in. */
export async function technicianDay(
  server: RunningServer,
  badge: string,
): Promise<{ token: string; day: MyDay }> {
  const login = await fetch(`${server.url}/api/auth/badge`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ badge, pin: '4321' }),
  });
  const token = ((await login.json()) as { accessToken: string }).accessToken;
  const day = (await fetch(`${server.url}/api/me/day`, {
    headers: { authorization: `Bearer ${token}` },
  }).then((r) => r.json())) as MyDay;
  return { token, day };
}

/** A finding as the kiosk sends it: multipart fields, and photos in `photos`. */
export async function recordFinding(
  server: RunningServer,
  token: string,
  lineId: number,
  fields: Record<string, string>,
  photos: { name: string; type: string; bytes: Buffer }[] = [],
): Promise<FindingDto> {
  const form = new FormData();
  for (const [name, value] of Object.entries(fields)) form.set(name, value);
  for (const photo of photos)
    form.append('photos', new Blob([new Uint8Array(photo.bytes)], { type: photo.type }), photo.name);
  const response = await fetch(`${server.url}/api/job-lines/${lineId}/findings`, {
    method: 'POST',
    headers: { authorization: `Bearer ${token}` },
    body: form,
  });
  if (response.status !== 201)
    throw new Error(`finding not recorded: ${response.status} ${await response.text()}`);
  return (await response.json()) as FindingDto;
}
