import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { cropBySlug } from '@shared/crops';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { mainNav, seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

const ids = async () => {
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  const radish = await db('crops').whereNull('club_id').where({ slug: 'radish' }).first('id');
  return { clubId: club.id as number, radishId: radish.id as number };
};
const overrides = async (clubId: number, cropId: number) =>
  db('crop_overrides').where({ club_id: clubId, crop_id: cropId }).select('field', 'value');
const dialogClosed = (page: Page) => page.waitForFunction(() => !document.querySelector('dialog[open]'));

// The reference radish as the page words it (src/features/crops/lib/format.ts formatMaturity).
const reference = cropBySlug('radish')!.daysToMaturity.value;
const referenceText = `${reference.min}–${reference.max} days from ${reference.from}`;

describe('club values and club crops', () => {
  it('the coordinator sets a club value on radish, keeps it over a reload, goes back to the reference, and adds a club crop', async () => {
    const { clubId, radishId } = await ids();
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await w.page.getByRole('heading', { level: 1, name: 'Mossgate Community Garden Club' }).waitFor();
    await (await mainNav(w.page)).getByRole('link', { name: 'Crop notes' }).click();
    const table = w.page.getByRole('table', { name: 'Crop notes' });
    await table.getByRole('link', { name: 'Radish', exact: true }).click();
    await w.page.getByRole('heading', { level: 1, name: 'Radish' }).waitFor();

    const growth = w.page.getByRole('region', { name: 'Growth and harvest' });
    await growth.getByText(referenceText, { exact: true }).waitFor();
    await growth.getByRole('button', { name: 'Use a club value: days to maturity' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Club value: days to maturity' });
    await dialog.waitFor();
    await dialog.getByLabel('Least (days)').fill('30');
    await dialog.getByLabel('Most (days)').fill('40');
    await dialog.getByLabel('Counted from').selectOption({ label: 'Sowing' });
    await dialog.getByLabel('Source of the club value').selectOption({ label: 'Common practice' });
    await w.shot('crop-club-value-dialog-desktop');
    expect(await axeViolations(w.page)).toEqual([]);
    await dialog.getByRole('button', { name: 'Save the club value' }).click();
    await dialogClosed(w.page);

    // computed: the 30 and 40 typed above, worded as formatMaturity does
    await growth.getByText('30–40 days from sowing', { exact: true }).waitFor();
    await growth.getByText('club value', { exact: true }).waitFor();
    await expect
      .poll(() => overrides(clubId, radishId))
      .toEqual([{ field: 'daysToMaturity', value: { value: { min: 30, max: 40, from: 'sowing' }, source: 'common-practice' } }]);

    await w.page.reload();
    await w.page.getByRole('heading', { level: 1, name: 'Radish' }).waitFor();
    await growth.getByText('30–40 days from sowing', { exact: true }).waitFor();
    await growth.getByText('club value', { exact: true }).waitFor();
    await w.shot('crop-club-value-set-desktop');

    await growth.getByRole('button', { name: 'Go back to the reference value: days to maturity' }).click();
    await growth.getByText(referenceText, { exact: true }).waitFor();
    await growth.getByText('club value', { exact: true }).waitFor({ state: 'detached' });
    await expect.poll(() => overrides(clubId, radishId)).toEqual([]);

    await w.page.getByRole('link', { name: 'All crop notes' }).click();
    await table.getByRole('link', { name: 'Radish', exact: true }).waitFor();
    await w.page.getByRole('button', { name: 'Add a club crop' }).click();
    const add = w.page.getByRole('dialog', { name: 'Add a club crop' });
    await add.waitFor();
    // Test values a coordinator might type for a crop the catalogue lacks, marked "From memory".
    // First under a name the reference crops already use: the server refuses it (409) on the name's input.
    await add.getByLabel('Common name').fill('Radish');
    await add.getByLabel('Botanical name', { exact: true }).fill('Vicia faba');
    await add.getByLabel('Botanical family', { exact: true }).fill('Fabaceae');
    await add.getByLabel('Kind').selectOption({ label: 'Legume' });
    await add.getByLabel('How it is sown').selectOption({ label: 'Sown direct' });
    await add.getByLabel('Least (days)').fill('80');
    await add.getByLabel('Most (days)').fill('100');
    await add.getByLabel('Counted from').selectOption({ label: 'Sowing' });
    for (const what of ['botanical name', 'family', 'sowing', 'days to maturity']) {
      await add.getByLabel(`Source of the ${what}`).selectOption({ label: 'From memory' });
    }
    await w.shot('crop-club-crop-dialog-desktop');
    await add.getByRole('button', { name: 'Save the club crop' }).click();
    // server/services/crops.ts createClubCrop: the field message for a reference crop's name.
    await add.getByText('Already in the reference crops', { exact: true }).waitFor();
    expect(await add.getByLabel('Common name').getAttribute('aria-invalid')).toBe('true');
    // The refused save keeps what was typed.
    expect(await add.getByLabel('Botanical name', { exact: true }).inputValue()).toBe('Vicia faba');
    expect(await add.getByLabel('Most (days)').inputValue()).toBe('100');
    expect(await add.getByLabel('Source of the days to maturity').inputValue()).toBe('from-memory');
    expect(await overrides(clubId, radishId)).toEqual([]);
    await add.getByLabel('Common name').fill('Broad bean');
    await add.getByRole('button', { name: 'Save the club crop' }).click();
    await dialogClosed(w.page);

    await w.page.getByRole('heading', { level: 1, name: 'Broad bean' }).waitFor();
    await w.page.getByText('Added by the club', { exact: false }).waitFor();
    await w.page.getByRole('region', { name: 'Growth and harvest' }).getByText('80–100 days from sowing', { exact: true }).waitFor();
    // A club crop's values are all the club's: no club-value buttons on its page.
    expect(await w.page.getByRole('button', { name: /^Use a club value/ }).count()).toBe(0);
    const row = await db('crops').where({ club_id: clubId, slug: 'broad-bean' }).first('common_name', 'family', 'kind', 'data');
    expect(row).toMatchObject({ common_name: 'Broad bean', family: 'Fabaceae', kind: 'legume' });
    expect(row.data.daysToMaturity).toEqual({ value: { min: 80, max: 100, from: 'sowing' }, source: 'from-memory' });
    await w.shot('crop-club-crop-desktop');
    // The browser logs the refused 409 itself; nothing else may reach the console.
    expect(w.errors.filter((e) => !/status of 409/.test(e))).toEqual([]);
    expect(w.errors.filter((e) => /status of 409/.test(e))).toHaveLength(1);
    await w.page.context().close();
  }, 90_000);

  it('at phone width the dialog fits and passes axe', async () => {
    const { clubId, radishId } = await ids();
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 390);
    await w.page.goto(`${suite.server.url}/clubs/${clubId}/crops/${radishId}`);
    await w.page.getByRole('heading', { level: 1, name: 'Radish' }).waitFor();
    await w.page.getByRole('button', { name: 'Use a club value: soil pH' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Club value: soil pH' });
    await dialog.getByLabel('Source of the club value').selectOption({ label: 'Another source' });
    await dialog.getByLabel('Which source, for the club value').fill('Club soil test, 2025');
    // shared/schemas/crops.ts rangeSchema: the most may not be below the least; checked before sending.
    await dialog.getByLabel('Least (pH)').fill('8');
    await dialog.getByLabel('Most (pH)').fill('6');
    await dialog.getByRole('button', { name: 'Save the club value' }).click();
    await dialog.getByText('Must not be below the minimum', { exact: true }).waitFor();
    await w.shot('crop-club-value-dialog-phone');
    expect(await axeViolations(w.page)).toEqual([]);
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await dialog.getByRole('button', { name: 'Cancel' }).click();
    await dialogClosed(w.page);
    expect(await overrides(clubId, radishId)).toEqual([]);
    await w.shot('crop-club-values-radish-phone');
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);

  it('a plot holder sees no club-value or club-crop buttons', async () => {
    const { clubId, radishId } = await ids();
    const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 1280);
    await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await w.page.goto(`${suite.server.url}/clubs/${clubId}/crops`);
    await w.page.getByRole('table', { name: 'Crop notes' }).getByRole('link', { name: 'Radish', exact: true }).waitFor();
    expect(await w.page.getByRole('button', { name: 'Add a club crop' }).count()).toBe(0);
    await w.page.goto(`${suite.server.url}/clubs/${clubId}/crops/${radishId}`);
    await w.page.getByRole('region', { name: 'Growth and harvest' }).getByText(referenceText, { exact: true }).waitFor();
    expect(await w.page.getByRole('button', { name: /^Use a club value/ }).count()).toBe(0);
    expect(await w.page.getByRole('button', { name: /^Go back to the reference value/ }).count()).toBe(0);
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);

  it('the coordinator adds a club relation for radish, sees it after a reload, and removes it', async () => {
    const { clubId, radishId } = await ids();
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await w.page.goto(`${suite.server.url}/clubs/${clubId}/crops/${radishId}`);
    await w.page.getByRole('heading', { level: 1, name: 'Radish' }).waitFor();
    await w.page.getByRole('button', { name: 'Add a club relation' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'A club relation for Radish' });
    await dialog.getByLabel('With').selectOption({ label: 'Chives' });
    await dialog.getByLabel('Why').fill('Our members find the chives keep flea beetles off the radish row.');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    await w.shot('crop-club-relation-dialog-desktop');
    await dialog.getByRole('button', { name: 'Save the relation' }).click();
    await dialogClosed(w.page);
    await w.page.reload();
    const companions = w.page.getByRole('region', { name: 'Companions' });
    const item = companions.getByRole('listitem').filter({ hasText: 'Our members find the chives' });
    await item.getByText('club relation', { exact: true }).waitFor();
    await item.getByText('common practice', { exact: false }).waitFor();
    const chives = await db('crops').whereNull('club_id').where({ slug: 'chives' }).first('id');
    const row = await db('crop_relations').where({ club_id: clubId }).first('crop_a_id', 'crop_b_id', 'effect', 'distance_m', 'evidence', 'source');
    expect(row).toEqual({ crop_a_id: radishId, crop_b_id: chives.id, effect: 'beneficial', distance_m: null, evidence: 'common_practice', source: 'common-practice' });

    await item.getByRole('button', { name: 'Remove the club relation with Chives' }).click();
    await expect.poll(() => item.count()).toBe(0);
    expect(await db('crop_relations').where({ club_id: clubId }).count({ n: '*' })).toEqual([{ n: 0 }]);
    expect(w.errors).toEqual([]);
    await w.page.context().close();
  }, 60_000);
});
