import fs from 'node:fs';
import path from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations, type AxeViolation } from '../helpers/axe';
import { openPage, SCREENSHOT_DIR, type WatchedPage } from '../helpers/browser';
import { seededServerAndBrowser, signInAs } from '../helpers/session';

const suite = seededServerAndBrowser();

type Role = 'anonymous' | 'volunteer' | 'plot-holder' | 'coordinator';

/** Demo people from seeds/01-demo-club.ts, one per role in the Mossgate club (Lucía volunteers, Teodor holds A-1, Maren coordinates). */
const PERSON: Record<Exclude<Role, 'anonymous'>, string> = {
  volunteer: 'lucia@example.org',
  'plot-holder': 'teodor@example.org',
  coordinator: 'maren@example.org',
};

// A token of the right length that matches nothing: e-mail link pages then show their designed "not valid" page.
const BAD_TOKEN = 'abcdefghijklmnopqrstuvwxyz0123456789ABCDEFG';

interface Ids {
  club: number;
  site: number;
  plot: number;
  crop: number;
  shift: number;
}

const MEMBERS: Role[] = ['volunteer', 'plot-holder', 'coordinator'];
const COORDINATOR: Role[] = ['coordinator'];

/**
 * Every client route by its pattern as written in src/app/router.tsx, with who may see it and the address to open.
 * Coordinators' pages are checked as coordinators only (others get the designed "for coordinators" dead end, which
 * is the same component everywhere). Public e-mail link pages are checked signed out.
 */
const PAGES: Record<string, { roles: Role[]; url: (ids: Ids) => string; unknownToken?: true }> = {
  '/sign-in': { roles: ['anonymous'], url: () => '/sign-in' },
  '/forgot-password': { roles: ['anonymous'], url: () => '/forgot-password' },
  '/start-a-club': { roles: ['anonymous'], url: () => '/start-a-club' },
  '/reset-password': { roles: ['anonymous'], url: () => `/reset-password?token=${BAD_TOKEN}`, unknownToken: true },
  '/invite': { roles: ['anonymous'], url: () => `/invite?token=${BAD_TOKEN}`, unknownToken: true },
  '/apply/:clubSlug': { roles: ['anonymous'], url: () => '/apply/mossgate' },
  '/respond/offer': { roles: ['anonymous'], url: () => `/respond/offer?token=${BAD_TOKEN}&answer=accept`, unknownToken: true },
  '/respond/renewal': { roles: ['anonymous'], url: () => `/respond/renewal?token=${BAD_TOKEN}&answer=accept`, unknownToken: true },
  '/shift-link': { roles: ['anonymous'], url: () => `/shift-link?token=${BAD_TOKEN}`, unknownToken: true },
  '/stop-mail': { roles: ['anonymous'], url: () => `/stop-mail?token=${BAD_TOKEN}`, unknownToken: true },
  '/*': { roles: ['anonymous', 'plot-holder'], url: () => '/no-such-page' },
  '/': { roles: MEMBERS, url: () => '/' },
  '/clubs/:clubId': { roles: MEMBERS, url: (i) => `/clubs/${i.club}` },
  '/clubs/:clubId/members': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/members` },
  '/clubs/:clubId/sites': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/sites` },
  '/clubs/:clubId/sites/:siteId/edit': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/sites/${i.site}/edit` },
  '/clubs/:clubId/sites/:siteId/plots': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/sites/${i.site}/plots` },
  '/clubs/:clubId/sites/:siteId/print': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/sites/${i.site}/print` },
  '/clubs/:clubId/sites/:siteId/weather': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/sites/${i.site}/weather` },
  '/clubs/:clubId/sites/:siteId/tasks': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/sites/${i.site}/tasks` },
  '/clubs/:clubId/sites/:siteId/water': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/sites/${i.site}/water` },
  '/clubs/:clubId/tasks': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/tasks` },
  '/clubs/:clubId/rain-gauge': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/rain-gauge` },
  '/clubs/:clubId/plots/:plotId': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/plots/${i.plot}` },
  // The book of A-1 is its holder's and the coordinators'; Mossgate does not share plot books with other members.
  '/clubs/:clubId/plots/:plotId/book': { roles: ['plot-holder', 'coordinator'], url: (i) => `/clubs/${i.club}/plots/${i.plot}/book` },
  '/clubs/:clubId/crops': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/crops` },
  '/clubs/:clubId/crops/:cropId': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/crops/${i.crop}` },
  '/clubs/:clubId/harvests': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/harvests` },
  '/clubs/:clubId/findings': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/findings` },
  '/clubs/:clubId/map': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/map` },
  '/clubs/:clubId/fees': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/fees` },
  '/clubs/:clubId/settings': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/settings` },
  '/clubs/:clubId/waitlist': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/waitlist` },
  '/clubs/:clubId/messages': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/messages` },
  '/clubs/:clubId/outgoing-mail': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/outgoing-mail` },
  '/clubs/:clubId/outgoing-mail/templates': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/outgoing-mail/templates` },
  '/clubs/:clubId/email-choices': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/email-choices` },
  '/clubs/:clubId/spring-round': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/spring-round` },
  '/clubs/:clubId/my-plot': { roles: ['plot-holder'], url: (i) => `/clubs/${i.club}/my-plot` },
  '/clubs/:clubId/shifts': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/shifts` },
  '/clubs/:clubId/shifts/print': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/shifts/print` },
  '/clubs/:clubId/shifts/plan': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/shifts/plan` },
  '/clubs/:clubId/shifts/:shiftId': { roles: MEMBERS, url: (i) => `/clubs/${i.club}/shifts/${i.shift}` },
  '/clubs/:clubId/my-shifts': { roles: ['volunteer'], url: (i) => `/clubs/${i.club}/my-shifts` },
  '/clubs/:clubId/hours': { roles: COORDINATOR, url: (i) => `/clubs/${i.club}/hours` },
};

/**
 * The route patterns in src/app/router.tsx, read from its source: each object literal's `path: '…'` joined to its
 * enclosing objects' paths, and `index: true` standing for its parent's path. A route added there without an
 * entry in PAGES fails the first test.
 */
function routerPatterns(source: string): string[] {
  const stack: Array<string | null> = [];
  const out = new Set<string>();
  const join = (parts: Array<string | null>) => `/${parts.filter((p): p is string => !!p && p !== '/').join('/')}`;
  const token = /\{|\}|path:\s*'([^']*)'|index:\s*true/g;
  for (let m = token.exec(source); m; m = token.exec(source)) {
    if (m[0] === '{') stack.push(null);
    else if (m[0] === '}') stack.pop();
    else if (m[1] !== undefined) {
      stack[stack.length - 1] = m[1];
      out.add(join(stack));
    } else out.add(join(stack.slice(0, -1)));
  }
  return [...out].sort();
}

/** Page name for files: the pattern without the club prefix or parameters' colons ("sites-siteId-edit"). */
function pageName(pattern: string): string {
  if (pattern === '/') return 'start';
  if (pattern === '/*') return 'not-found';
  if (pattern === '/clubs/:clubId') return 'club-home';
  return pattern.replace(/^\/clubs\/:clubId\//, '').replace(/^\//, '').replaceAll(':', '').replaceAll('/', '-');
}

interface PageResult {
  page: string;
  role: Role;
  width: number;
  file: string;
  violations: AxeViolation[];
  problems: string[];
}
const results: PageResult[] = [];

/** WCAG 2.5.5 (AAA) asks 44 by 44 CSS px; the product holds itself to it. */
const MIN_TARGET = 44; // source: WCAG 2.1 success criterion 2.5.5 Target Size

/**
 * Buttons, links and form controls in the main content smaller than 44 × 44 px. Left out, as 2.5.5 allows: links
 * inside running text (in a <p>: the "inline" exception), and the plots on a site map (`.map-grid`) or marks in an
 * <svg>, which are drawn to scale (the "essential" exception; the same plots are 44 px links in the site's plot
 * table). A checkbox or radio counts with its label, which also toggles it.
 */
async function smallTargets(page: Page): Promise<string[]> {
  return page.evaluate((min) => {
    const root = document.querySelector('main') ?? document.body;
    const out: string[] = [];
    const controls = root.querySelectorAll<HTMLElement>(
      'a[href], button, input:not([type=hidden]), select, textarea, [role=button], [role=link], [role=tab], [role=checkbox], [role=switch]',
    );
    for (const el of controls) {
      if (el.closest('svg, .map-grid') || (el.tagName === 'A' && el.closest('p'))) continue;
      const style = getComputedStyle(el);
      if (style.visibility === 'hidden' || style.display === 'none') continue;
      let rect = el.getBoundingClientRect();
      const input = el as HTMLInputElement;
      if (el.tagName === 'INPUT' && (input.type === 'checkbox' || input.type === 'radio')) {
        const label = el.closest('label') ?? (el.id ? document.querySelector(`label[for="${CSS.escape(el.id)}"]`) : null);
        if (label) {
          const l = label.getBoundingClientRect();
          if (l.width * l.height > rect.width * rect.height) rect = l;
        }
      }
      if (rect.width === 0 && rect.height === 0) continue; // not rendered (a closed menu, a hidden row)
      if (el.closest('[hidden], [aria-hidden=true]')) continue;
      if (rect.width + 0.5 < min || rect.height + 0.5 < min) {
        const name = (el.getAttribute('aria-label') ?? el.textContent ?? input.name ?? '').trim().replace(/\s+/g, ' ').slice(0, 40);
        const kind = el.tagName === 'INPUT' ? `input[${input.type}]` : el.tagName.toLowerCase();
        out.push(`${kind} "${name}" ${Math.round(rect.width)}×${Math.round(rect.height)}`);
      }
    }
    return [...new Set(out)];
  }, MIN_TARGET);
}

async function loadIds(): Promise<Ids> {
  const db = createDb(testConfig().databaseUrl);
  try {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const site = await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
    const plot = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.club_id': club.id, 'p.label': 'A-1' }).first('p.id');
    const crop = await db('crops').whereNull('club_id').where({ slug: 'radish' }).first('id');
    const shift = await db('shifts').where({ club_id: club.id }).where('starts_at', '>', new Date()).orderBy('starts_at').first('id');
    return { club: club.id, site: site.id, plot: plot.id, crop: crop.id, shift: shift.id };
  } finally {
    await db.destroy();
  }
}

async function visit(w: WatchedPage, url: string, width: number, unknownToken = false): Promise<{ violations: AxeViolation[]; problems: string[] }> {
  const before = w.errors.length;
  await w.page.goto(`${suite.server.url}${url}`);
  await w.page.locator('h1').first().waitFor().catch((e: Error) => {
    throw new Error(`${url}: no page heading (h1) appeared: ${e.message}`);
  });
  await w.page.waitForLoadState('networkidle');
  // Let lazy parts (cards, maps) that arrive after the page's own answers settle before measuring.
  await w.page.waitForFunction(() => !document.querySelector('[role=status][aria-busy=true], .animate-spin'), undefined, { timeout: 5_000 }).catch(() => {});
  const problems: string[] = [];
  if (width < 640) {
    const sideways = await w.page.evaluate(() => {
      const s = document.scrollingElement!;
      return { scroll: s.scrollWidth, client: s.clientWidth };
    });
    if (sideways.scroll > sideways.client) problems.push(`scrolls sideways: ${sideways.scroll} > ${sideways.client}`);
  }
  for (const t of await smallTargets(w.page)) problems.push(`small target: ${t}`);
  const violations = await axeViolations(w.page);
  for (const e of w.errors.slice(before)) {
    // The page asks the server about a token that matches nothing and shows its designed "link not valid" page;
    // Chromium logs that 404 answer itself. Any other error still counts.
    if (unknownToken && /status of 404/.test(e)) continue;
    problems.push(`console error: ${e}`);
  }
  return { violations, problems };
}

afterAll(() => {
  if (results.length === 0) return;
  const rows = [...results].sort((a, b) => a.page.localeCompare(b.page) || a.role.localeCompare(b.role) || b.width - a.width);
  const lines = [
    '# Every page, every role',
    '',
    'Written by tests/browser/every-page.test.ts. Axe: WCAG 2.1 A/AA rules of axe-core. Other: console errors,',
    'sideways scroll at 390 px and targets under 44 × 44 px in the main content.',
    '',
    '| Page | Role | Width | Screenshot | Axe | Other |',
    '| --- | --- | --- | --- | --- | --- |',
    ...rows.map(
      (r) =>
        `| ${r.page} | ${r.role} | ${r.width} | [${r.file}](${r.file}) | ${r.violations.length === 0 ? 'no violations' : r.violations.map((v) => `${v.id} (${v.nodes.length})`).join(', ')} | ${r.problems.length === 0 ? 'none' : r.problems.join('; ').replaceAll('|', '\\|')} |`,
    ),
    '',
  ];
  fs.mkdirSync(SCREENSHOT_DIR, { recursive: true });
  fs.writeFileSync(path.join(SCREENSHOT_DIR, 'index.md'), lines.join('\n'));
});

describe('every page, as every role that may see it, at desktop and phone width', () => {
  const source = fs.readFileSync(path.resolve(import.meta.dirname, '..', '..', 'src', 'app', 'router.tsx'), 'utf8');

  it('has an entry for every route in the router, and none for a route that is gone', () => {
    expect(Object.keys(PAGES).sort()).toEqual(routerPatterns(source));
  });

  it('reads nested and index routes from a router source', () => {
    // computed: the sample below nests 'b' and an index under 'a', under the root '/'.
    const sample = `[{ path: '/', children: [{ path: 'a', children: [{ index: true, Component: X }, { path: 'b', lazy: () => f().then((m) => ({ Component: m.B })) }] }, { path: '*' }] }]`;
    expect(routerPatterns(sample)).toEqual(['/', '/*', '/a', '/a/b']);
  });

  it('moves focus to the new page heading on a route change, and a dialog keeps and then returns focus', async () => {
    const ids = await loadIds();
    const w = await signInAs(suite.browser, suite.server.url, PERSON.coordinator, 1280);
    await w.page.locator('h1').first().waitFor();
    await w.page.getByRole('navigation', { name: 'Main' }).getByRole('link', { name: 'Sites' }).click();
    await w.page.getByRole('heading', { level: 1, name: 'Sites' }).waitFor();
    await expect.poll(() => w.page.evaluate(() => `${document.activeElement?.tagName} ${document.activeElement?.textContent}`)).toBe('H1 Sites');

    await w.page.goto(`${suite.server.url}/clubs/${ids.club}/shifts/plan`);
    const opener = w.page.getByRole('button', { name: 'Add a shift of your own' }).first();
    await opener.click();
    const dialog = w.page.getByRole('dialog', { name: 'Add a shift of your own' });
    await dialog.waitFor();
    // Tab through more stops than the dialog has: focus never leaves it (the native modal <dialog> makes the rest inert).
    for (let i = 0; i < 15; i++) {
      await w.page.keyboard.press('Tab');
      expect(await w.page.evaluate(() => !!document.activeElement?.closest('dialog[open]') || document.activeElement === document.body)).toBe(true);
    }
    await w.page.keyboard.press('Escape');
    await dialog.waitFor({ state: 'hidden' });
    await expect.poll(() => w.page.evaluate(() => document.activeElement?.textContent?.trim())).toBe('Add a shift of your own');
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);

  const roles: Role[] = ['anonymous', 'volunteer', 'plot-holder', 'coordinator'];
  for (const width of [1280, 390]) {
    for (const role of roles) {
      it(`${role} at ${width} px: no axe violations, console errors, sideways scroll or small targets`, async () => {
        const ids = await loadIds();
        const w =
          role === 'anonymous' ? await openPage(suite.browser, width) : await signInAs(suite.browser, suite.server.url, PERSON[role], width);
        if (role !== 'anonymous') await w.page.locator('h1').first().waitFor();
        const failures: Array<{ page: string; violations: AxeViolation[]; problems: string[] }> = [];
        for (const [pattern, entry] of Object.entries(PAGES)) {
          if (!entry.roles.includes(role)) continue;
          const page = pageName(pattern);
          const { violations, problems } = await visit(w, entry.url(ids), width, entry.unknownToken);
          const file = `${page}-${role}-${width}.png`;
          await w.shot(file.replace(/\.png$/, ''));
          results.push({ page, role, width, file, violations, problems });
          if (violations.length > 0 || problems.length > 0) failures.push({ page, violations, problems });
        }
        await w.page.context().close();
        expect(failures).toEqual([]);
      }, 400_000);
    }
  }
});
