import { chromium, type BrowserContext, type Page } from 'playwright-core';
import { mkdtempSync, mkdirSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

export const SCREENSHOT_DIR = fileURLToPath(new URL('../screenshots/', import.meta.url));

/** Debian's chromium, headless, with the flags this closed network needs. */
export async function openBrowser(viewport = { width: 1280, height: 800 }): Promise<BrowserContext> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  return chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), 'baytime-chromium-')), {
    executablePath: process.env.CHROMIUM_PATH ?? '/usr/bin/chromium',
    headless: true,
    viewport,
    args: [
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
}

export async function newPage(
  context: BrowserContext,
  viewport?: { width: number; height: number },
): Promise<Page> {
  const page = await context.newPage();
  if (viewport) await page.setViewportSize(viewport);
  return page;
}

export const screenshotPath = (name: string) => join(SCREENSHOT_DIR, `${name}.png`);
