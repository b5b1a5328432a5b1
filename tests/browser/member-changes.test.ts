import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import { seededServerAndBrowser, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

const noDialog = () => !document.querySelector('dialog[open]');

describe('changing a member on the members page', () => {
  it('gives a plot holder the concession and a volunteer role; the fees page shows the re-priced fee after a reload', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const samir = await db('users').where({ email: 'samir@example.org' }).first('id');
    const fee = await db('fees').where({ user_id: samir.id }).first('plot_fee_minor');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/members`);
    const row = w.page.getByRole('row').filter({ hasText: 'samir@example.org' });
    await row.getByText('Full').waitFor();

    await row.getByRole('button', { name: 'Change… Samir Haddad' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Change Samir Haddad' });
    expect(await dialog.getByLabel('Plot holder').isChecked()).toBe(true);
    await dialog.getByLabel('Volunteer').check();
    await dialog.getByLabel('Pays the concession rate').check();
    await w.shot('member-change-desktop');
    await dialog.getByRole('button', { name: 'Save changes' }).click();
    await w.page.waitForFunction(noDialog);

    await w.page.reload();
    await row.getByText('Concession').waitFor();
    expect(await row.getByRole('list', { name: 'Roles' }).innerText()).toMatch(/Plot holder\s+Volunteer/);
    expect(await db('memberships').where({ club_id: club.id, user_id: samir.id }).orderBy('role').pluck('role')).toEqual(['plot_holder', 'volunteer']);

    // Samir's fee had nothing paid, so it is re-priced at the demo club's 50 % concession.
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/fees`);
    await w.page.reload();
    const feeRow = w.page.getByRole('row').filter({ hasText: 'Samir Haddad' });
    await feeRow.getByText('Concession').waitFor();
    const half = Math.round(fee.plot_fee_minor / 2);
    const pounds = `£${(half / 100).toFixed(2)}`;
    await feeRow.getByText(pounds, { exact: true }).first().waitFor();
    expect((await db('fees').where({ user_id: samir.id }).first('plot_fee_minor')).plot_fee_minor).toBe(half);
    await w.shot('fees-after-concession-desktop');
    expect(w.errors).toEqual([]);
  }, 60_000);

  it('refuses to take coordinator from the club’s only coordinator, keeping what was ticked', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 390);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/members`);
    await w.page.getByRole('button', { name: 'Change… Maren Okafor' }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Change Maren Okafor' });
    await dialog.getByLabel('Coordinator').uncheck();
    await dialog.getByLabel('Plot holder').check();
    await dialog.getByRole('button', { name: 'Save changes' }).click();
    await dialog.getByText('A club needs at least one coordinator. Make someone else coordinator first.').waitFor();
    expect(await dialog.getByLabel('Plot holder').isChecked()).toBe(true);
    expect(await dialog.getByLabel('Coordinator').isChecked()).toBe(false);
    await w.shot('member-change-refused-phone');
    const maren = await db('users').where({ email: 'maren@example.org' }).first('id');
    expect(await db('memberships').where({ club_id: club.id, user_id: maren.id }).pluck('role')).toEqual(['coordinator']);
    // The browser logs the 409 answer itself; nothing else may be logged.
    expect(w.errors.filter((e) => !e.includes('409'))).toEqual([]);
  }, 60_000);
});
