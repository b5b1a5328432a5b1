import type { Page } from 'playwright-core';
import { afterAll, describe, expect, it } from 'vitest';
import { formatWeight } from '@shared/plot-book';
import type { UnitSystem } from '@shared/geometry';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { mainNav, seededServerAndBrowser, signInAs } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

/** Each crop's total grams in a Mossgate season, read from the seeded rows (plantings in the ground, live sites). */
async function seasonTotals(year: number): Promise<Map<string, number>> {
  const rows: Array<{ common_name: string; grams: string | null }> = await db('plantings as pl')
    .leftJoin('harvests as h', 'h.planting_id', 'pl.id')
    .join('seasons as se', 'se.id', 'pl.season_id')
    .join('plots as p', 'p.id', 'pl.plot_id')
    .join('sites as s', 's.id', 'p.site_id')
    .join('clubs as c', 'c.id', 's.club_id')
    .join('crops as cr', 'cr.id', 'pl.crop_id')
    .where({ 'c.slug': 'mossgate', 'se.year': year })
    .whereNull('s.archived_at')
    .whereNot('pl.status', 'planned')
    .groupBy('cr.common_name')
    .select('cr.common_name', db.raw('sum(h.grams) as grams'));
  return new Map(rows.map((r) => [r.common_name, Number(r.grams ?? 0)]));
}

async function mainUnits(): Promise<UnitSystem> {
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  const site = await db('sites').where({ club_id: club.id }).whereNull('archived_at').orderBy('id').first('units');
  return site.units;
}

async function expectNoViolations(page: Page, width: number) {
  await page.waitForLoadState('networkidle');
  expect({ width, violations: await axeViolations(page) }).toEqual({ width, violations: [] });
}

describe('harvest figures', () => {
  it('a plot holder opens Harvests from the phone menu, reads the 2026 tomato total and switches to 2025', async () => {
    const units = await mainUnits();
    const y2026 = await seasonTotals(2026);
    const y2025 = await seasonTotals(2025);
    const tomato = y2026.get('Tomato');
    expect(tomato).toBeGreaterThan(0);
    // The heaviest crop of 2025, whichever the seed makes it.
    const [top2025, top2025Grams] = [...y2025.entries()].sort((a, b) => b[1] - a[1])[0];

    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await (await mainNav(w.page)).getByRole('link', { name: 'Harvests' }).click();
    await w.page.getByRole('heading', { level: 1, name: 'Harvests' }).waitFor();
    const table2026 = w.page.getByRole('table', { name: 'Harvest figures per crop, 2026' });
    const tomatoRow = table2026.getByRole('row').filter({ has: w.page.getByRole('link', { name: 'Tomato', exact: true }) });
    await tomatoRow.getByRole('cell', { name: formatWeight(tomato!, units), exact: true }).waitFor();
    // The chart writes the same figure beside the crop's name.
    await w.page.getByRole('img', { name: /^Total weight per crop:/ }).waitFor();
    expect(await w.page.getByRole('img', { name: /^Total weight per crop:/ }).getAttribute('aria-label')).toContain(`Tomato ${formatWeight(tomato!, units)}`);
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('harvests-2026-phone');
    await expectNoViolations(w.page, 390);

    await w.page.getByLabel('Season').selectOption('2025');
    const table2025 = w.page.getByRole('table', { name: 'Harvest figures per crop, 2025' });
    const topRow = table2025.getByRole('row').filter({ has: w.page.getByRole('link', { name: top2025, exact: true }) });
    await topRow.getByRole('cell', { name: formatWeight(top2025Grams, units), exact: true }).waitFor();
    expect(new URL(w.page.url()).searchParams.get('year')).toBe('2025');
    await w.shot('harvests-2025-phone');
    await expectNoViolations(w.page, 390);
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);

  it('at desktop width the table sorts by total weight and has no axe violations', async () => {
    const units = await mainUnits();
    const y2026 = await seasonTotals(2026);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 1280);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/harvests?year=2026`);
    const table = w.page.getByRole('table', { name: 'Harvest figures per crop, 2026' });
    await table.getByRole('link', { name: 'Tomato', exact: true }).waitFor();
    // Heaviest first by default; the same order as the database's sums.
    const expected = [...y2026.entries()].sort((a, b) => b[1] - a[1] || a[0].localeCompare(b[0])).map(([name]) => name);
    expect((await table.getByRole('link').allInnerTexts()).map((t) => t.trim())).toEqual(expected);
    await table.getByRole('cell', { name: formatWeight(y2026.get('Tomato')!, units), exact: true }).waitFor();
    await w.shot('harvests-2026-desktop');
    await expectNoViolations(w.page, 1280);

    await w.page.getByLabel('Season').selectOption('2025');
    await w.page.getByRole('table', { name: 'Harvest figures per crop, 2025' }).waitFor();
    await w.shot('harvests-2025-desktop');
    await expectNoViolations(w.page, 1280);
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);
});
