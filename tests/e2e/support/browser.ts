import fs from 'node:fs';
import path from 'node:path';
import { type Browser, chromium, type Page } from 'playwright-core';
import { afterAll, beforeAll, inject } from 'vitest';

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
export async function openPage(browser: Browser, baseUrl: string, options: PageOptions = {}): Promise<Page> {
  const context = await browser.newContext({
    baseURL: baseUrl,
    viewport: options.viewport ?? DESKTOP,
    timezoneId: options.timezoneId ?? 'UTC',
  });
  return context.newPage();
}

export const SCREENSHOT_DIR = path.resolve('tests/output/screenshots');

export async function saveScreenshot(
  page: Page,
  name: string,
  options: { fullPage?: boolean } = {},
): Promise<string> {
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  const file = path.join(SCREENSHOT_DIR, `${name}.png`);
  await page.screenshot({ path: file, fullPage: options.fullPage });
  return file;
}

export type PageOptions = { viewport?: Viewport; timezoneId?: string };

/**
 * One browser per test file, launched before its tests and closed after them; `open` gives each
 * test its own signed-out page on the server started by the global setup.
 */
export function useBrowser() {
  const baseUrl = inject('baseUrl');
  let browser: Browser | undefined;
  beforeAll(async () => {
    browser = await launchBrowser();
  });
  afterAll(async () => {
    await browser?.close();
  });
  return {
    open: (options: PageOptions = {}) => {
      if (!browser) throw new Error('useBrowser: the browser is not launched yet (call open inside a test)');
      return openPage(browser, baseUrl, options);
    },
  };
}
