import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { mainNav, seededServerAndBrowser, signInAsCoordinator, switchClub } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
let clubId: number;

beforeAll(async () => {
  clubId = (await db('clubs').where({ slug: 'mossgate' }).first('id')).id;
});
afterAll(async () => {
  await db.destroy();
});

async function settingsAtMossgate(width: number) {
  const w = await signInAsCoordinator(suite.browser, suite.server.url, width);
  await switchClub(w.page);
  await (await mainNav(w.page)).getByRole('link', { name: 'Settings' }).click();
  await w.page.getByRole('heading', { name: 'Settings', level: 1 }).waitFor();
  return w;
}

describe('club settings', () => {
  it('with fees recorded, the currency cannot be chosen and the field says why', async () => {
    // The demo seed (seeds/03-demo-spring-round.ts) records 2026 fees at Mossgate in GBP.
    expect(await db('fees').where({ club_id: clubId }).first('id')).toBeDefined();
    const w = await settingsAtMossgate(1280);
    const currency = w.page.getByLabel('Currency');
    await expect.poll(() => currency.isDisabled()).toBe(true);
    const describedBy = (await currency.getAttribute('aria-describedby')) ?? '';
    const reasons = await Promise.all(describedBy.split(' ').filter(Boolean).map((id) => w.page.locator(`[id="${id}"]`).textContent()));
    expect(reasons.join(' ')).toContain('Fees are already recorded in Pound sterling (£), so the currency cannot change');
    await w.shot('club-settings-currency-locked-1280');
    expect(w.errors).toEqual([]);
  });

  it('a save the server refuses keeps every value typed, and the next save stores them all', async () => {
    const w = await settingsAtMossgate(390);
    const before = await db('clubs').where({ id: clubId }).first('name', 'offer_days', 'renewal_days', 'contact_email', 'fee_note', 'typical_wait');
    // A bell character: the form lets it through, the server refuses control characters in text (textSchema).
    await w.page.getByLabel('Club name').fill('Mossgate\u0007 Growers');
    await w.page.getByLabel('Days to answer an offer').fill('12');
    await w.page.getByLabel('Days to answer a renewal').fill('25');
    await w.page.getByLabel('Contact e-mail').fill('hello@mossgate.example.org');
    await w.page.getByLabel('Fee, for the application form').fill('From £25 a year for a small plot');
    await w.page.getByLabel('Typical wait, for the application form').fill('About 18 months');
    await w.page.getByLabel('Years before a family returns to the same soil').fill('4');
    await w.page.getByLabel("Let members read each other's plot books").check();
    await w.page.getByRole('button', { name: 'Save club settings' }).click();
    await w.page.getByText('Remove the control character', { exact: false }).first().waitFor();
    expect(await db('clubs').where({ id: clubId }).first('name', 'offer_days', 'renewal_days', 'contact_email', 'fee_note', 'typical_wait')).toEqual(before);
    await expect.poll(() => w.page.getByLabel('Days to answer an offer').inputValue()).toBe('12');
    expect(await w.page.getByLabel('Days to answer a renewal').inputValue()).toBe('25');
    expect(await w.page.getByLabel('Contact e-mail').inputValue()).toBe('hello@mossgate.example.org');
    expect(await w.page.getByLabel('Fee, for the application form').inputValue()).toBe('From £25 a year for a small plot');
    expect(await w.page.getByLabel('Typical wait, for the application form').inputValue()).toBe('About 18 months');
    expect(await w.page.getByLabel('Club name').inputValue()).toBe('Mossgate\u0007 Growers');
    expect(await w.page.getByLabel('Years before a family returns to the same soil').inputValue()).toBe('4');
    await w.shot('club-settings-refused-390');

    await w.page.getByLabel('Club name').fill(before.name);
    await w.page.getByRole('button', { name: 'Save club settings' }).click();
    await w.page.getByText('Club settings saved.').waitFor();
    expect(await db('clubs').where({ id: clubId }).first('offer_days', 'renewal_days', 'contact_email', 'fee_note', 'typical_wait', 'rotation_gap_years', 'shares_plot_books')).toEqual({
      rotation_gap_years: 4,
      shares_plot_books: true,
      offer_days: 12,
      renewal_days: 25,
      contact_email: 'hello@mossgate.example.org',
      fee_note: 'From £25 a year for a small plot',
      typical_wait: 'About 18 months',
    });
    await w.shot('club-settings-saved-390');
    expect(w.errors.filter((e) => !/status of 400/.test(e))).toEqual([]);
  });
});
