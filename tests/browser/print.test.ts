import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { footprint } from '@shared/geometry';
import type { Plot } from '@shared/schemas/plots';
import type { PlotSeasonState } from '@shared/schemas/seasons';
import type { Shift } from '@shared/schemas/shifts';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

/** The pages of a PDF: its page objects ("/Type /Page", not the "/Type /Pages" tree). PDF 1.7 §7.7.3.3. */
function pdfPageCount(pdf: Buffer): number {
  return pdf.toString('latin1').match(/\/Type\s*\/Page(?![a-zA-Z])/g)?.length ?? 0;
}

/** Every page's /MediaBox [x0 y0 x1 y1] in points, as width and height. PDF 1.7 §7.7.3.3. */
function pdfPageSizes(pdf: Buffer): Array<{ w: number; h: number }> {
  return [...pdf.toString('latin1').matchAll(/\/MediaBox\s*\[\s*([\d.]+)\s+([\d.]+)\s+([\d.]+)\s+([\d.]+)\s*\]/g)].map((m) => ({
    w: Number(m[3]) - Number(m[1]),
    h: Number(m[4]) - Number(m[2]),
  }));
}

/** A GET on the API with the page's own session (its cookies), as the page's hooks make it. */
async function api<T>(page: Page, path: string): Promise<T> {
  const res = await page.request.get(`${suite.server.url}${path}`);
  expect(res.status(), path).toBe(200);
  return (await res.json()) as T;
}

async function mapData(page: Page, clubId: number, siteId: number) {
  const plots = (await api<{ items: Plot[] }>(page, `/api/sites/${siteId}/plots`)).items;
  const seasons = (await api<{ items: Array<{ id: number; year: number }> }>(page, `/api/clubs/${clubId}/seasons`)).items;
  const states = (await api<{ items: PlotSeasonState[] }>(page, `/api/seasons/${seasons[0].id}/plot-states?siteId=${siteId}`)).items;
  return { plots, states };
}

/** What the map prints on a plot besides its label, read from the drawing. */
const wordOn = (page: Page, label: string) => page.locator(`[data-testid="print-map"] g[data-plot="${label}"] .plot-word`);

// Twelve millimetres of margin on every side, as the print stylesheet's @page asks (Chromium's pdf() takes its own margins).
const margin = { top: '12mm', right: '12mm', bottom: '12mm', left: '12mm' };

describe('the printable site map', () => {
  it('draws each plot to scale with its label, free plots hatched and marked, a legend, scale bar and north, on one landscape page', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const lane = await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    const { page } = w;
    await page.goto(`${suite.server.url}/clubs/${club.id}/map`);
    await page.getByRole('heading', { name: 'Map of Mossgate Lane' }).waitFor();
    await page.getByRole('link', { name: 'Print map' }).click();
    await page.getByRole('heading', { level: 1, name: 'Mossgate Lane: site map' }).waitFor();
    expect(new URL(page.url()).pathname).toBe(`/clubs/${club.id}/sites/${lane.id}/print`);
    const svg = page.getByTestId('print-map');
    await svg.waitFor();

    // One shape per plot the API lists, at the plot's place and size in metres, with its label.
    const { plots, states } = await mapData(page, club.id, lane.id);
    expect(plots.length).toBeGreaterThan(0);
    expect(await svg.locator('rect.plot-shape').count()).toBe(plots.length);
    for (const p of plots) {
      const g = svg.locator(`g[data-plot="${p.label}"]`);
      expect(await g.locator('.plot-label').textContent()).toBe(p.label);
      const rect = g.locator('rect.plot-shape');
      const fp = footprint(p);
      const got = await rect.evaluate((r) => ['x', 'y', 'width', 'height'].map((a) => Number(r.getAttribute(a))));
      expect(got.map((v) => Math.round(v * 1000))).toEqual([fp.minX, fp.minY, fp.maxX - fp.minX, fp.maxY - fp.minY].map((v) => Math.round(v * 1000)));
    }

    // Free plots: hatched (a pattern fill) and the word "Free", never the colour alone.
    const byId = new Map(plots.map((p) => [p.id, p]));
    const free = states.filter((s) => s.status === 'free' && byId.get(s.plotId)?.kind !== 'shared_bed');
    expect(free.length).toBeGreaterThan(0);
    for (const s of free) {
      const label = byId.get(s.plotId)!.label;
      expect(await wordOn(page, label).textContent()).toBe('Free');
      expect(await svg.locator(`g[data-plot="${label}"] rect.plot-shape`).getAttribute('fill')).toMatch(/^url\(#/);
    }
    const notFree = plots.filter((p) => !free.some((s) => s.plotId === p.id));
    for (const p of notFree) expect(await svg.locator(`g[data-plot="${p.label}"] rect.plot-shape`).getAttribute('fill')).toBeNull();

    // Holders as initials (the default), full names or nothing, remembered in the URL.
    const held = states.filter((s) => s.status === 'taken' && s.holder);
    expect(held.length).toBeGreaterThan(0);
    const heldLabel = byId.get(held[0].plotId)!.label;
    const holderName = held[0].holder!.name;
    // computed: the first letter of each of the first two words of the name ("Teodor Lind" → "TL").
    const expectedInitials = holderName.split(/\s+/).slice(0, 2).map((x) => x[0]!.toUpperCase()).join('');
    expect(await wordOn(page, heldLabel).textContent()).toBe(expectedInitials);
    await page.getByLabel('Holders on the map').selectOption('full');
    await expect.poll(() => new URL(page.url()).searchParams.get('names')).toBe('full');
    await expect.poll(() => wordOn(page, heldLabel).textContent()).toBe(holderName);
    await page.getByLabel('Holders on the map').selectOption('none');
    await expect.poll(() => new URL(page.url()).searchParams.get('names')).toBe('none');
    await expect.poll(() => wordOn(page, heldLabel).count()).toBe(0);
    await page.reload();
    await svg.waitFor();
    expect(await page.getByLabel('Holders on the map').inputValue()).toBe('none');
    await page.getByLabel('Holders on the map').selectOption('initials');
    await expect.poll(() => wordOn(page, heldLabel).textContent()).toBe(expectedInitials);

    // Legend, scale bar in the site's units, north arrow, the printing date.
    const legend = page.getByRole('list', { name: 'Legend' });
    await expect.poll(() => legend.textContent()).toContain('Free');
    expect(await legend.textContent()).toContain('Taken (holder’s initials)');
    // computed: the site is 34 m wide (seeds/02-demo-sites.ts); a quarter is 8.5 m, and the largest of 5, 2, 1 × 10ⁿ under it is 5.
    const bar = svg.getByTestId('scale-bar');
    expect(await bar.locator('text').textContent()).toBe('5 m');
    // On the page the bar is as long, against the site's outline, as 5 m is against 34 m.
    const barPx = (await bar.locator('path').boundingBox())!.width;
    const sitePx = (await svg.locator(':scope > rect').first().boundingBox())!.width;
    expect(barPx / sitePx).toBeCloseTo(5 / 34, 1); // computed: 5 / 34 ≈ 0.147 (strokes add a hair)
    const north = svg.getByTestId('north-arrow');
    // The arrow is lucide's ArrowUp, an svg of its own inside the map's.
    expect(await north.locator('svg').count()).toBe(1);
    expect(await north.locator('text').textContent()).toBe('N');
    const site = await db('sites').where({ id: lane.id }).first('time_zone');
    // The app's date style is "3 Dec 2026" (shared/dates), on the site's clock: built here from Intl's parts.
    const parts = new Intl.DateTimeFormat('en-US', { timeZone: site.time_zone, day: 'numeric', month: 'short', year: 'numeric' }).formatToParts(new Date());
    const part = (t: string) => parts.find((x) => x.type === t)!.value;
    const printed = `${part('day')} ${part('month')} ${part('year')}`;
    await page.getByText(`Printed ${printed}`).waitFor();

    expect({ violations: await axeViolations(page) }).toEqual({ violations: [] });
    await w.shot('print-site-map');

    // On paper: no app header or navigation, no buttons or choices; the map and legend stay.
    const nav = page.getByRole('navigation', { name: 'Main' });
    expect(await nav.isVisible()).toBe(true);
    await page.emulateMedia({ media: 'print' });
    expect(await nav.isVisible()).toBe(false);
    expect(await page.getByRole('banner').filter({ has: page.getByRole('link', { name: 'Tillwell home' }) }).isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    expect(await page.getByLabel('Holders on the map').isVisible()).toBe(false);
    expect(await svg.isVisible()).toBe(true);
    expect(await legend.isVisible()).toBe(true);
    await w.shot('print-site-map-print-media');

    // One landscape page: the stylesheet's own size, then A4 and US Letter as a person might pick them.
    const css = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    expect(pdfPageCount(css)).toBe(1);
    const [size] = pdfPageSizes(css);
    expect(size.w).toBeGreaterThan(size.h);
    for (const format of ['A4', 'Letter'] as const) {
      const pdf = await page.pdf({ format, landscape: true, margin, printBackground: true });
      expect({ format, pages: pdfPageCount(pdf) }).toEqual({ format, pages: 1 });
    }
    expect(w.errors).toEqual([]);
    await page.context().close();
  }, 90_000);

  it('uses feet on a US-units site', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const orchard = await db('sites').where({ club_id: club.id, name: 'Orchard Corner' }).first('id', 'units');
    expect(orchard.units).toBe('us');
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/sites/${orchard.id}/print`);
    const svg = w.page.getByTestId('print-map');
    await svg.waitFor();
    // computed: 84 ft wide (seeds/02-demo-sites.ts); a quarter is 21 ft, and the largest of 5, 2, 1 × 10ⁿ under it is 20.
    expect(await svg.getByTestId('scale-bar').locator('text').textContent()).toBe('20 ft');
    // computed: 20 ft × 0.3048 m/ft (the international foot) = 6.096 m.
    expect(Number(await svg.getByTestId('scale-bar').getAttribute('data-metres'))).toBeCloseTo(6.096, 6);
    const pdf = await w.page.pdf({ format: 'Letter', landscape: true, margin, printBackground: true });
    expect(pdfPageCount(pdf)).toBe(1);
    await w.shot('print-site-map-us');
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);

  it('shows a plot holder the labels only, with no choice of names', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const lane = await db('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 1280);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/sites/${lane.id}/print?names=full`);
    await w.page.getByTestId('print-map').waitFor();
    const { states, plots } = await mapData(w.page, club.id, lane.id);
    expect(await w.page.getByLabel('Holders on the map').count()).toBe(0);
    // Teodor's own holding comes with his name from the API; the sheet still prints no name.
    const own = states.find((s) => s.status === 'taken' && s.holder);
    expect(own).toBeDefined();
    const label = plots.find((p) => p.id === own!.plotId)!.label;
    expect(await wordOn(w.page, label).count()).toBe(0);
    expect(await w.page.getByTestId('print-map').textContent()).not.toContain(own!.holder!.name);
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);
});

describe('the printable shift rota', () => {
  it('lists the week by day on each site’s clock, with names for the coordinator and a blank line per open place', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const first = await db('shifts').where({ club_id: club.id }).where('starts_at', '>', new Date()).orderBy('starts_at').first('on_date');
    const date = typeof first.on_date === 'string' ? first.on_date : first.on_date.toISOString().slice(0, 10);
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    const { page } = w;
    await page.goto(`${suite.server.url}/clubs/${club.id}/shifts?date=${date}`);
    await page.getByRole('heading', { level: 1, name: 'Shifts' }).waitFor();
    await page.getByRole('link', { name: 'Print this week' }).click();
    await page.getByRole('heading', { level: 1, name: /^Shift rota, / }).waitFor();
    expect(new URL(page.url()).pathname).toBe(`/clubs/${club.id}/shifts/print`);

    // The week on the page starts on the Monday of the shift's date (ISO 8601 weeks, as the board's).
    const from = mondayOf(new URL(page.url()).searchParams.get('date') ?? date);
    const week = await api<{ items: Shift[]; from: string; to: string }>(page, `/api/clubs/${club.id}/shifts?from=${from}&to=${addDays(from, 6)}`);
    expect(week.items.length).toBeGreaterThan(0);
    const rows = page.locator('tr[data-shift]');
    await rows.first().waitFor();
    expect(await rows.count()).toBe(week.items.length);
    // One section per day that has shifts.
    expect(await page.locator('section.rota-day').count()).toBe(new Set(week.items.map((s) => s.date)).size);
    for (const s of week.items) {
      const row = page.locator(`tr[data-shift="${s.id}"]`);
      const text = (await row.textContent()) ?? '';
      // The site's wall clock as the API gives it (startTime, endTime), not the browser's.
      expect(text).toContain(`${s.startTime}–${s.endTime}`);
      expect(text).toContain(s.siteName);
      expect(text).toContain(s.title);
      expect(text).toContain(`${s.taken} of ${s.capacity} taken`);
      const names = (s.people ?? []).filter((p) => p.status === 'taken' || p.status === 'done').map((p) => p.name);
      expect(await row.locator('.rota-name').allTextContents()).toEqual(names);
      const open = s.state === 'needs_people' ? Math.max(0, s.capacity - s.taken) : 0;
      expect({ shift: s.id, blanks: await row.locator('.rota-blank').count() }).toEqual({ shift: s.id, blanks: open });
    }
    // The demo's first compost morning: Lucía holds one of its places (seeds/07).
    expect(week.items.some((s) => (s.people ?? []).some((p) => p.name === 'Lucía Ferreira'))).toBe(true);
    await page.getByText('Lucía Ferreira').first().waitFor();

    expect({ violations: await axeViolations(page) }).toEqual({ violations: [] });
    await w.shot('print-shift-rota');

    const nav = page.getByRole('navigation', { name: 'Main' });
    expect(await nav.isVisible()).toBe(true);
    await page.emulateMedia({ media: 'print' });
    expect(await nav.isVisible()).toBe(false);
    expect(await page.getByRole('button', { name: 'Print' }).isVisible()).toBe(false);
    expect(await page.getByRole('link', { name: 'Back to the shifts' }).isVisible()).toBe(false);
    expect(await rows.first().isVisible()).toBe(true);
    await w.shot('print-shift-rota-print-media');
    const pdf = await page.pdf({ preferCSSPageSize: true, printBackground: true });
    expect(pdfPageCount(pdf)).toBeGreaterThan(0);
    const [size] = pdfPageSizes(pdf);
    expect(size.w).toBeGreaterThan(size.h);
    expect(w.errors).toEqual([]);
    await page.context().close();
  }, 90_000);

  it('gives a volunteer the rota without other people’s names', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const first = await db('shifts').where({ club_id: club.id }).where('starts_at', '>', new Date()).orderBy('starts_at').first('on_date');
    const date = typeof first.on_date === 'string' ? first.on_date : first.on_date.toISOString().slice(0, 10);
    const w = await signInAs(suite.browser, suite.server.url, 'ben@example.org', 1280);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/shifts/print?date=${date}`);
    await w.page.locator('tr[data-shift]').first().waitFor();
    expect(await w.page.locator('.rota-name').count()).toBe(0);
    expect(await w.page.getByText('Lucía Ferreira').count()).toBe(0);
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);
});

/** A calendar date `n` days on (UTC arithmetic on a YYYY-MM-DD date). */
function addDays(iso: string, n: number): string {
  const d = new Date(`${iso}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + n);
  return d.toISOString().slice(0, 10);
}

/** The Monday on or before a YYYY-MM-DD date (ISO 8601 weeks start on Monday). */
function mondayOf(iso: string): string {
  const day = new Date(`${iso}T00:00:00Z`).getUTCDay(); // 0 Sunday … 6 Saturday
  return addDays(iso, -((day + 6) % 7));
}
