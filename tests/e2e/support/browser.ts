import fs from 'node:fs';
import path from 'node:path';
import { type Browser, chromium, type Page } from 'playwright-core';

const CHROMIUM = process.env.CHROMIUM_PATH ?? '/usr/bin/chromium';

/** Debian's Chromium, headless, with the flags that work on this kind of machine (see shared stack notes). */
export function launchBrowser(): Promise<Browser> {
  return chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--headless',
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

export interface Viewport {
  width: number;
  height: number;
}

export const DESKTOP: Viewport = { width: 1280, height: 800 };
export const NARROW: Viewport = { width: 1024, height: 768 };

/** A fresh context per page, so cookies never leak between signed-in roles. */
export async function openPage(
  browser: Browser,
  baseUrl: string,
  options: { viewport?: Viewport; timezoneId?: string } = {},
): Promise<Page> {
  const context = await browser.newContext({
    baseURL: baseUrl,
    viewport: options.viewport ?? DESKTOP,
    timezoneId: options.timezoneId ?? 'UTC',
  });
  return context.newPage();
}

export const SCREENSHOT_DIR = path.resolve('tests/output/screenshots');

export async function saveScreenshot(page: Page, name: string): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file });
  return file;
}
