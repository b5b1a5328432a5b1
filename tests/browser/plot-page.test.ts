import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { newToken } from '../../server/services/tokens';
import { testConfig } from '../helpers/app';
import { seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

describe('the plot page while the next season is open', () => {
  it('names the newest season and where the plot stands in it, for the coordinator and for the holder', async () => {
    // The demo club held 2026; 2027 is open and Teodor's renewal of A-1 waits for his answer.
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const teodor = await db('users').where({ email: 'teodor@example.org' }).first('id');
    const a1 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.club_id': club.id, 'p.label': 'A-1' }).first('p.id');
    const last = await db('seasons').where({ club_id: club.id, year: 2026 }).first('id');
    const held = await db('allocations').where({ season_id: last.id, plot_id: a1.id }).first('id');
    const [season] = await db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    await db('renewals').insert({
      season_id: season.id,
      previous_allocation_id: held.id,
      plot_id: a1.id,
      user_id: teodor.id,
      token_hash: newToken().hash,
      deadline: new Date('2027-01-15T23:59:59Z'),
    });

    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/plots/${a1.id}`);
    const panel = w.page.getByRole('region', { name: 'The 2027 season' });
    // 23:59:59 UTC on 15 January is 23:59 in London (GMT in winter).
    await panel.getByText(/^Waiting for Teodor Lind to renew for 2027, until 15 Jan 2027, 23:59/).waitFor();
    expect(await panel.getByText('for 2026').count()).toBe(0);
    await w.shot('plot-page-next-season-desktop');
    expect(w.errors).toEqual([]);

    const h = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', 390);
    // Sign-in ends on the club's home; wait for it so the redirect cannot overtake the next address.
    await h.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
    await h.page.goto(`${suite.server.url}/clubs/${club.id}/plots/${a1.id}`);
    await h.page.getByRole('region', { name: 'The 2027 season' }).getByText(/^Waiting for Teodor Lind to renew for 2027/).waitFor();
    expect(await h.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    // The holder is sent no names in the history, so it says none rather than guessing at one.
    const history = h.page.getByRole('region', { name: 'History' });
    await history.getByText('Drawn on the map as A-1').waitFor();
    expect(await history.getByText('Someone no longer in the club').count()).toBe(0);
    await h.shot('plot-page-next-season-phone');
    expect(h.errors).toEqual([]);
  }, 60_000);
});
