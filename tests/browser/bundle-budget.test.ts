import fs from 'node:fs';
import path from 'node:path';
import zlib from 'node:zlib';
import { describe, expect, it } from 'vitest';
import type { Browser, BrowserContext, Page } from 'playwright-core';
import { DEMO_CLUB, seededServerAndBrowser, signInAs } from '../helpers/session';

const suite = seededServerAndBrowser();

const DIST = path.resolve(import.meta.dirname, '..', '..', 'dist');
// A plot holder in Mossgate (seeds/01-demo-club.ts: Teodor Lind, roles ['plot_holder']).
const HOLDER = 'teodor@example.org';
// The brief's budget: 150 KB of JS + CSS gzipped, taken as KiB. computed: 150 × 1024 = 153,600 bytes.
const BUDGET_BYTES = 150 * 1024;
// A phone's width (the brief: 390 px).
const PHONE = 390;

/** Gzipped size of a built file, at zlib's level 9 (the smallest gzip; a server's default level 6 is a little larger). */
function gzipSize(file: string): number {
  return zlib.gzipSync(fs.readFileSync(file), { level: 9 }).length;
}

/** Built files whose source maps name a module matching the pattern: the chunks that carry it. */
function chunksWithModule(pattern: RegExp): string[] {
  const dir = path.join(DIST, 'assets');
  return fs
    .readdirSync(dir)
    .filter((name) => name.endsWith('.js.map'))
    .filter((name) => (JSON.parse(fs.readFileSync(path.join(dir, name), 'utf8')) as { sources: string[] }).sources.some((s) => pattern.test(s)))
    .map((name) => `assets/${name.replace(/\.map$/, '')}`);
}

interface ManifestChunk {
  file: string;
  css?: string[];
}

/** The built files (script and its stylesheets) of a module that the build's manifest lists as a chunk of its own. */
function manifestFiles(moduleName: string): string[] {
  const manifest = JSON.parse(fs.readFileSync(path.join(DIST, '.vite', 'manifest.json'), 'utf8')) as Record<string, ManifestChunk>;
  const chunk = manifest[moduleName];
  if (!chunk) throw new Error(`${moduleName} is not a chunk of its own in dist/.vite/manifest.json`);
  return [chunk.file, ...(chunk.css ?? [])];
}

interface Loaded {
  files: string[];
  total: number;
  listing: string;
}

/** Records every script and stylesheet the page fetches from the build (its path under dist/). */
function recordAssets(page: Page): string[] {
  const seen: string[] = [];
  page.on('response', (response) => {
    const pathname = new URL(response.url()).pathname;
    if (/\.(js|css)$/.test(pathname) && !seen.includes(pathname.slice(1))) seen.push(pathname.slice(1));
  });
  return seen;
}

function measure(files: string[]): Loaded {
  const sizes = files.map((file) => [file, gzipSize(path.join(DIST, file))] as const);
  const total = sizes.reduce((sum, [, size]) => sum + size, 0);
  const listing = [...sizes, ['total', total] as const].map(([file, size]) => `${(size / 1024).toFixed(1).padStart(7)} KiB  ${file}`).join('\n');
  return { files, total, listing };
}

/** A fresh browser context (empty cache) of a phone's width, signed in with the cookies of `from` when given. */
async function freshContext(browser: Browser, from?: BrowserContext): Promise<BrowserContext> {
  return browser.newContext({
    viewport: { width: PHONE, height: 860 },
    deviceScaleFactor: 1,
    storageState: from ? await from.storageState() : undefined,
  });
}

/** Opens `url` in the context, waits until the page is settled (the `ready` locator shown and no request for 500 ms). */
async function openSettled(context: BrowserContext, url: string, ready: (page: Page) => ReturnType<Page['getByRole']>) {
  const page = await context.newPage();
  const errors: string[] = [];
  page.on('console', (msg) => {
    if (msg.type() === 'error') errors.push(msg.text());
  });
  page.on('pageerror', (err) => errors.push(err.message));
  const files = recordAssets(page);
  await page.goto(url);
  await ready(page).waitFor();
  await page.waitForLoadState('networkidle');
  return { page, files, errors };
}

describe('what the first page loads', () => {
  it("keeps a plot holder's home within 150 KiB of gzipped JS and CSS, without the map editor or the calendar", async () => {
    const signIn = await signInAs(suite.browser, suite.server.url, HOLDER, PHONE);
    await signIn.page.getByRole('heading', { name: DEMO_CLUB }).waitFor();
    expect(signIn.errors).toEqual([]);

    // The first page as a holder opens it: "/" in a new context with an empty cache, already signed in.
    const context = await freshContext(suite.browser, signIn.page.context());
    const home = await openSettled(context, `${suite.server.url}/`, (page) => page.getByRole('heading', { name: 'My plot' }));
    // Both of the holder's sections are drawn and nothing on the page is still loading.
    await home.page.getByRole('heading', { name: 'Your fees' }).waitFor();
    await expect.poll(() => home.page.getByRole('status').filter({ hasText: /Loading/ }).count()).toBe(0);
    await home.page.waitForLoadState('networkidle');
    expect(home.errors).toEqual([]);
    const loaded = measure(home.files);
    await context.close();
    await signIn.page.context().close();

    console.log(`The holder's home loads ${loaded.files.length} scripts and stylesheets, ${loaded.total} bytes gzipped (level 9)`);
    expect(loaded.files.length, 'no script or stylesheet was seen').toBeGreaterThan(0);
    if (loaded.total > BUDGET_BYTES) {
      expect.fail(`The holder's home loads ${loaded.total} bytes gzipped, over ${BUDGET_BYTES}:\n${loaded.listing}`);
    }

    // The map editor (its route holds @dnd-kit) and the shift calendar (react-big-calendar) stay out.
    const heavy = [
      ...manifestFiles('src/app/routes/map.tsx'),
      ...manifestFiles('src/features/shifts/components/shift-calendar.tsx'),
      ...chunksWithModule(/node_modules\/(@dnd-kit|react-big-calendar)\//),
    ];
    expect(heavy.length).toBeGreaterThan(2);
    expect(loaded.files.filter((file) => heavy.includes(file)), loaded.listing).toEqual([]);
  });

  it('prints what the sign-in page loads for a visitor (no budget)', async () => {
    const context = await freshContext(suite.browser);
    const signIn = await openSettled(context, `${suite.server.url}/sign-in`, (page) => page.getByRole('button', { name: 'Sign in' }));
    expect(signIn.errors).toEqual([]);
    const loaded = measure(signIn.files);
    await context.close();
    console.log(`The sign-in page loads (gzip level 9):\n${loaded.listing}`);
    expect(loaded.total).toBeGreaterThan(0);
  });
});
