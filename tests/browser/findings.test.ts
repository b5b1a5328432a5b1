import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// The demo (seeds/04): on A-1, cabbage grew in the north half in 2025 and tomato grows there in 2026.
// The club's rotation gap is 3 years, so cabbage again in 2026 is a clash; basil beside tomato is a
// good pairing in the crop notes' relations (seeds/01).
const reason = 'Last cabbages before the bed goes to grass; no clubroot seen here.';

describe('the neighbour check', () => {
  it('a holder on a phone sees a clash before saving, keeps it with a reason, and adds a good pairing', async () => {
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await w.page.getByRole('link', { name: 'Open the plot book' }).click();
    await w.page.getByRole('heading', { name: 'Plot book: A-1' }).waitFor();
    const plantings = w.page.getByRole('region', { name: 'Plantings in 2026' });

    await w.page.getByRole('button', { name: 'Add a planting' }).click();
    const check = plantings.getByRole('region', { name: 'Before you save: the neighbour check' });
    await plantings.getByText('Choose a crop and a date to see how it sits', { exact: false }).waitFor();
    await plantings.getByLabel('Find a crop').fill('cabb');
    await plantings.getByLabel('Crop', { exact: true }).selectOption({ label: 'Cabbage' });
    await plantings.getByLabel('Date', { exact: false }).first().fill('2026-07-04');
    // The dry run, asked as the form settles, names the earlier planting and the club's gap.
    await check.getByText(/Cabbage \(Brassicaceae\) here follows cabbage \(Brassicaceae\) from 2025/).waitFor();
    await check.getByText(/3 years/).first().waitFor();
    // Nothing is saved by the dry run.
    const a1 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 'p.label': 'A-1', 's.name': 'Mossgate Lane' }).first('p.id');
    const before = await db('plantings').where({ plot_id: a1.id }).count<{ count: string }[]>('id as count');
    // A clash asks why it is kept; saving without a reason is stopped on the form.
    const why = plantings.getByLabel('Why keep this planting?');
    await why.waitFor();
    await plantings.getByRole('button', { name: 'Save the planting' }).click();
    await expect.poll(async () => (await db('plantings').where({ plot_id: a1.id }).count<{ count: string }[]>('id as count'))[0].count).toBe(before[0].count);
    await why.scrollIntoViewIfNeeded();
    await w.shot('findings-planting-clash-phone');
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await why.fill(reason);
    await plantings.getByRole('button', { name: 'Save the planting' }).click();
    await w.page.getByText('Cabbage saved. Its dates are below.').waitFor();

    const cabbage = await db('plantings as pl').join('crops as c', 'c.id', 'pl.crop_id').where({ 'pl.plot_id': a1.id, 'c.slug': 'cabbage', 'pl.planted_on': '2026-07-04' }).first('pl.id', 'pl.keep_reason');
    expect(cabbage.keep_reason).toBe(reason);
    const stored = await db('findings').where({ planting_id: cabbage.id }).select('severity', 'kind');
    expect(stored).toContainEqual({ severity: 'clash', kind: 'rotation' });

    // Now a good pairing: basil beside the tomato.
    await w.page.getByRole('button', { name: 'Add a planting' }).click();
    await plantings.getByLabel('Find a crop').fill('bas');
    await plantings.getByLabel('Crop', { exact: true }).selectOption({ label: 'Basil' });
    await plantings.getByLabel('Date', { exact: false }).first().fill('2026-06-06');
    await check.getByText(/good pairing/i).first().waitFor();
    await check.getByText(/basil and tomato do well together/).first().waitFor();
    expect(await plantings.getByLabel('Why keep this planting?').count()).toBe(0);
    await plantings.getByRole('button', { name: 'Save the planting' }).click();
    await w.page.getByText('Basil saved. Its dates are below.').waitFor();
    const basil = await db('plantings as pl').join('crops as c', 'c.id', 'pl.crop_id').where({ 'pl.plot_id': a1.id, 'c.slug': 'basil' }).first('pl.id', 'pl.keep_reason');
    expect(basil.keep_reason).toBeNull();
    expect(await db('findings').where({ planting_id: basil.id, severity: 'good' }).count<{ count: string }[]>('id as count')).not.toEqual([{ count: '0' }]);

    // The plot book lists the plot's findings, the kept reason with the clash.
    const found = w.page.getByRole('region', { name: /^Neighbour check/ }).first();
    await found.scrollIntoViewIfNeeded();
    await found.getByText(reason, { exact: false }).first().waitFor();
    await w.shot('findings-plot-book-phone');
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 90_000);

  it('the coordinator sees both on the map overlay and in the season’s findings table', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const a1 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 'p.label': 'A-1', 's.name': 'Mossgate Lane' }).first('p.id', 's.id as site_id');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/map?site=${a1.site_id}`);
    await w.page.getByRole('button', { name: /Show neighbour check/ }).click();
    const mark = w.page.getByRole('button', { name: /^Neighbour check for plot A-1: / });
    await mark.waitFor();
    // The mark's name counts by severity in words, not only by shape and colour.
    const name = (await mark.textContent()) ?? '';
    expect(name).toMatch(/\d+ clash/);
    expect(name).toMatch(/\d+ good pairing/);
    // A real pointer on the mark opens the plot's findings beside the map.
    const box = (await mark.boundingBox())!;
    await w.page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
    await w.page.mouse.down();
    await w.page.mouse.up();
    const panel = w.page.getByRole('region', { name: 'Neighbour check findings' });
    await panel.getByText(/Cabbage \(Brassicaceae\) here follows cabbage/).first().waitFor();
    await panel.getByText(reason, { exact: false }).first().waitFor();
    await panel.getByText(/basil and tomato do well together/).first().waitFor();
    await w.page.getByRole('region', { name: 'Neighbour check legend' }).waitFor();
    // The overlay is a view: nothing on the map moved.
    const plot = await db('plots').where({ id: a1.id }).first('x_m', 'y_m');
    await w.shot('findings-map-overlay-desktop');

    // The findings table: filter to clashes, the kept reason in the row, CSV with the same filter.
    await w.page.getByRole('link', { name: 'Neighbour check' }).first().click();
    const table = w.page.getByRole('table', { name: /Neighbour check findings/ });
    await table.waitFor();
    await w.page.getByLabel('Severity').selectOption({ label: 'Clash' });
    await expect.poll(() => new URL(w.page.url()).searchParams.get('severity')).toBe('clash');
    const row = table.getByRole('row').filter({ hasText: reason });
    await row.first().waitFor();
    await expect.poll(async () => (await table.getByRole('row').allInnerTexts()).slice(1).every((t) => /clash/i.test(t))).toBe(true);
    const [download] = await Promise.all([w.page.waitForEvent('download'), w.page.getByRole('link', { name: /Download CSV/ }).or(w.page.getByRole('button', { name: /Download CSV/ })).click()]);
    const csv = await (await download.createReadStream()).toArray();
    const text = Buffer.concat(csv).toString('utf8');
    expect(text).toContain(reason);
    expect(text.split('\n').slice(1).filter((l) => l.trim()).every((l) => /clash/i.test(l))).toBe(true);
    await w.shot('findings-table-desktop');
    expect(await db('plots').where({ id: a1.id }).first('x_m', 'y_m')).toEqual(plot);
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 60_000);

  it('the findings table and the overlay fit a phone', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 390);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/findings`);
    await w.page.getByRole('table', { name: /Neighbour check findings/ }).waitFor();
    await w.page.getByRole('table', { name: /Neighbour check findings/ }).getByRole('row').nth(1).waitFor();
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('findings-table-phone');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/map`);
    await w.page.getByRole('button', { name: /Show neighbour check/ }).click();
    const mark = w.page.getByRole('button', { name: /^Neighbour check for plot A-2: / });
    await mark.waitFor();
    await mark.click();
    await w.page.getByRole('region', { name: 'Neighbour check findings' }).getByText(/Tomato \(Solanaceae\) here follows potato \(Solanaceae\) from 2025/).first().waitFor();
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('findings-map-overlay-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 60_000);
});
