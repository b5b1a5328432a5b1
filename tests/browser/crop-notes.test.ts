import { afterAll, describe, expect, it } from 'vitest';
import { SAFETY_CAUTION, companionCaution, cropRelations, crops, cropSourceById } from '@shared/crops';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { mainNav, seededServerAndBrowser, signInAs } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

const titleOf = (id: string) => {
  const source = cropSourceById(id);
  if (!source) throw new Error(`No source ${id} in shared/crops/sources.ts`);
  return source.title;
};

describe('crop notes', () => {
  it('a plot holder finds radish from the menu on a phone and reads its values with their sources, a companion and the caution', async () => {
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await (await mainNav(w.page)).getByRole('link', { name: 'Crop notes' }).click();
    await w.page.getByRole('heading', { name: 'Crop notes', exact: true }).waitFor();
    const table = w.page.getByRole('table', { name: 'Crop notes' });
    await table.getByRole('link', { name: 'Beet', exact: true }).waitFor();

    await w.page.getByLabel('Search by name').fill('rad');
    // Beet's row goes once the filter has run; radish stays.
    await table.getByRole('link', { name: 'Beet', exact: true }).waitFor({ state: 'detached' });
    await w.shot('crop-notes-search-phone');
    await table.getByRole('link', { name: 'Radish', exact: true }).click();

    await w.page.getByRole('heading', { level: 1, name: 'Radish' }).waitFor();
    const names = w.page.getByRole('region', { name: 'Name and family' });
    await names.getByText('Brassicaceae', { exact: true }).waitFor();
    await names.getByText(titleOf('wvu-rotation'), { exact: false }).waitFor();

    const germination = w.page.getByRole('region', { name: 'Germination and emergence' });
    // shared/crops/crops.ts: radish row of the OSU table, printed as 40 / 45–90 / 95 °F.
    // computed: (40 − 32) × 5 / 9 = 4.4 °C; (45 − 32) × 5 / 9 = 7.2; (90 − 32) × 5 / 9 = 32.2; (95 − 32) × 5 / 9 = 35.
    await germination.getByText('Lowest: 4.4 °C (40 °F)').waitFor();
    await germination.getByText('Best: 7.2–32.2 °C (45–90 °F)').waitFor();
    await germination.getByText('Highest: 35 °C (95 °F)').waitFor();
    expect(await germination.getByText(titleOf('osu-germination'), { exact: false }).count()).toBe(1);
    expect(await germination.getByText(titleOf('harrington-emergence'), { exact: false }).count()).toBe(1);

    const companions = w.page.getByRole('region', { name: 'Companions' });
    const carrot = cropRelations.find((r) => [r.a, r.b].includes('radish') && [r.a, r.b].includes('carrot'));
    expect(carrot).toBeDefined();
    await companions.getByRole('link', { name: 'Carrot', exact: true }).waitFor();
    await companions.getByText(carrot!.reason).waitFor();
    await companions.getByText(companionCaution.value).waitFor();

    // The radish guidance talks of fertiliser and sprays; the caution shows once, not after each text.
    await w.page.getByRole('region', { name: 'Growing guidance' }).getByText(SAFETY_CAUTION, { exact: false }).waitFor();
    expect(await w.page.getByText(SAFETY_CAUTION, { exact: false }).count()).toBe(1);

    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('crop-notes-radish-phone');
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);

  it('at desktop width the family filter narrows the table to the amaranth family', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 1280);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/crops`);
    const table = w.page.getByRole('table', { name: 'Crop notes' });
    await table.getByRole('link', { name: 'Radish', exact: true }).waitFor();
    await w.shot('crop-notes-table-desktop');

    await w.page.getByLabel('Family').selectOption('Amaranthaceae');
    await table.getByRole('link', { name: 'Radish', exact: true }).waitFor({ state: 'detached' });
    const shown = (await table.getByRole('link').allInnerTexts()).map((t) => t.trim());
    // shared/crops/crops.ts: beet, Swiss chard and spinach are the catalogue's Amaranthaceae; sorted by name.
    const expected = crops.filter((c) => c.family.value === 'Amaranthaceae').map((c) => c.commonName);
    expect([...expected].sort()).toEqual(['Beet', 'Spinach', 'Swiss chard']);
    expect(shown).toEqual(['Beet', 'Spinach', 'Swiss chard']);
    await w.shot('crop-notes-amaranth-desktop');
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);
});
