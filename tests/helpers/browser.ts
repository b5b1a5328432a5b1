import fs from 'node:fs';
import path from 'node:path';
import { chromium, type Browser, type Page } from 'playwright-core';
import { CHROMIUM } from './chromium';

export const SCREENSHOT_DIR = path.resolve(import.meta.dirname, '..', '..', 'screenshots');

/** Starts Debian's Chromium headless (playwright gives it a fresh temporary profile) with no background traffic. */
export async function launchBrowser(): Promise<{ browser: Browser; close(): Promise<void> }> {
  const browser = await chromium.launch({
    executablePath: CHROMIUM,
    args: [
      '--no-sandbox',
      '--headless',
      '--disable-gpu',
      '--disable-quic',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
      '--no-first-run',
    ],
  });
  return {
    browser,
    async close() {
      await browser.close();
    },
  };
}

export interface WatchedPage {
  page: Page;
  /** Console errors and uncaught page errors seen so far; a test asserts this stays empty. */
  errors: string[];
  shot(name: string): Promise<string>;
}

/** Opens a page of the given width that records console errors and saves screenshots. */
export async function openPage(browser: Browser, width = 1280, height = 860): Promise<WatchedPage> {
  const context = await browser.newContext({ viewport: { width, height }, deviceScaleFactor: 1 });
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') errors.push(msg.text());
  });
  page.on('pageerror', (err) => errors.push(err.message));
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  return {
    page,
    errors,
    async shot(name) {
      const file = path.join(SCREENSHOT_DIR, `${name}.png`);
      await page.screenshot({ path: file, fullPage: true });
      return file;
    },
  };
}
