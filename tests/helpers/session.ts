import { afterAll, beforeAll } from 'vitest';
import type { Browser, Locator, Page } from 'playwright-core';
import type { RunningServer } from '../../server/start-server';
import { DEMO_PASSWORD } from '../../seeds/01-demo-club';
import { launchBrowser, openPage, type WatchedPage } from './browser';
import { startSeededServer } from './server';

/** The demo coordinator; she is in two clubs and lands on Cinder Lane Growers first. */
export const DEMO_COORDINATOR = 'maren@example.org';
/** The demo club with the sites, plots, waitlist and fees. */
export const DEMO_CLUB = 'Mossgate Community Garden Club';

export interface BrowserSuite {
  readonly server: RunningServer;
  readonly browser: Browser;
}

/** Starts the seeded server and Chromium before a test file's tests and stops both after them. */
export function seededServerAndBrowser(): BrowserSuite {
  let server: RunningServer | undefined;
  let launched: Awaited<ReturnType<typeof launchBrowser>> | undefined;
  beforeAll(async () => {
    server = await startSeededServer();
    launched = await launchBrowser();
  });
  afterAll(async () => {
    await launched?.close();
    await server?.stop();
  });
  // Read only inside tests, once beforeAll has run.
  return {
    get server() {
      if (!server) throw new Error('The seeded server is not running yet');
      return server;
    },
    get browser() {
      if (!launched) throw new Error('The browser is not running yet');
      return launched.browser;
    },
  };
}

/** Opens a page of the given width at `start` (the sign-in page unless said) and signs in with the demo password. */
export async function signInAs(browser: Browser, serverUrl: string, email: string, width: number, start = '/sign-in'): Promise<WatchedPage> {
  const w = await openPage(browser, width);
  await w.page.goto(`${serverUrl}${start}`);
  await w.page.getByLabel('E-mail').fill(email);
  await w.page.getByLabel('Password').fill(DEMO_PASSWORD);
  await w.page.getByRole('button', { name: 'Sign in' }).click();
  return w;
}

/**
 * Signs the demo coordinator in and waits for the club home she lands on: the club she last used,
 * which is Mossgate (the club she runs) until a test switches her to Cinder Lane Growers.
 */
export async function signInAsCoordinator(browser: Browser, serverUrl: string, width: number, start?: string): Promise<WatchedPage> {
  const w = await signInAs(browser, serverUrl, DEMO_COORDINATOR, width, start);
  await w.page.getByRole('heading', { level: 1, name: /^(Mossgate Community Garden Club|Cinder Lane Growers)$/ }).waitFor();
  return w;
}

/** Opens the menu when it is shown and closed (on a phone), so the navigation and club switcher are visible. */
export async function openMenuIfClosed(page: Page): Promise<void> {
  const menu = page.getByRole('button', { name: /menu/i });
  if ((await menu.isVisible()) && (await menu.getAttribute('aria-expanded')) !== 'true') await menu.click();
}

/** The main navigation as a person sees it, with the menu opened first on a phone. */
export async function mainNav(page: Page): Promise<Locator> {
  await openMenuIfClosed(page);
  return page.getByRole('navigation', { name: 'Main' }).filter({ visible: true });
}

/** Switches club with the switcher (in the open menu on a phone; the header's copy is hidden there) and waits for its home. */
export async function switchClub(page: Page, name = DEMO_CLUB): Promise<void> {
  await openMenuIfClosed(page);
  await page.getByLabel('Club').filter({ visible: true }).selectOption({ label: name });
  await page.getByRole('heading', { name }).waitFor();
}
