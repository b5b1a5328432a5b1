import crypto from 'node:crypto';
import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { newToken } from '../../server/services/tokens';
import { testConfig } from '../helpers/app';
import { openPage } from '../helpers/browser';
import { seededServerAndBrowser } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

// A token of the same shape as a real one (32 random bytes, base64url) that the server never issued.
const madeUp = () => crypto.randomBytes(32).toString('base64url');

describe('e-mailed links opened on a phone', () => {
  it('a cut-short or made-up offer link says the link is not valid, not that fields need attention', async () => {
    const w = await openPage(suite.browser, 390);
    for (const token of ['abc', madeUp()]) {
      await w.page.goto(`${suite.server.url}/respond/offer?token=${token}&answer=accept`);
      await w.page.getByRole('heading', { name: 'This link is not valid' }).waitFor();
      expect(await w.page.getByText('Some fields need attention').count()).toBe(0);
      expect(await w.page.getByRole('button', { name: 'Accept the plot' }).count()).toBe(0);
    }
    await w.shot('offer-link-not-valid-phone');
    await w.page.setViewportSize({ width: 1280, height: 860 });
    await w.shot('offer-link-not-valid-desktop');
    // The browser logs the 400 and 404 answers itself; nothing else may be logged.
    expect(w.errors.filter((e) => !/\b(400|404)\b/.test(e))).toEqual([]);
  });

  it('a made-up password reset link is refused on opening, before anyone types a password', async () => {
    const w = await openPage(suite.browser, 390);
    await w.page.goto(`${suite.server.url}/reset-password?token=${madeUp()}`);
    await w.page.getByRole('heading', { name: "This reset link doesn't work" }).waitFor();
    expect(await w.page.getByLabel('New password').count()).toBe(0);
    await w.page.getByRole('link', { name: 'Send a new link' }).waitFor();
    await w.shot('reset-link-not-valid-phone');
    await w.page.setViewportSize({ width: 1280, height: 860 });
    await w.shot('reset-link-not-valid-desktop');
    expect(w.errors.filter((e) => !/\b(400|404)\b/.test(e))).toEqual([]);
  });

  it('the decline link opens "Decline this plot?" with one answer; declining is saved', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const ines = await db('applications').where({ club_id: club.id, email: 'ines@example.org' }).first('id');
    const a3 = await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.club_id': club.id, 'p.label': 'A-3' }).first('p.id');
    const [season] = await db('seasons').insert({ club_id: club.id, year: 2027 }).returning('id');
    const { token, hash } = newToken();
    const [offer] = await db('offers')
      .insert({ season_id: season.id, plot_id: a3.id, application_id: ines.id, token_hash: hash, deadline: new Date(Date.now() + 7 * 24 * 3600 * 1000) })
      .returning('id');
    await db('applications').where({ id: ines.id }).update({ status: 'offered' });

    const w = await openPage(suite.browser, 390);
    await w.page.goto(`${suite.server.url}/respond/offer?token=${encodeURIComponent(token)}&answer=decline`);
    await w.page.getByRole('heading', { name: 'Decline this plot?' }).waitFor();
    await w.page.getByText('A-3, Mossgate Lane').waitFor();
    // Opening the link changes nothing (mail scanners fetch links); only the button does.
    expect((await db('offers').where({ id: offer.id }).first('status')).status).toBe('pending');
    expect(await w.page.getByRole('button', { name: 'Accept the plot' }).count()).toBe(0);
    await w.shot('offer-decline-link-phone');
    await w.page.setViewportSize({ width: 1280, height: 860 });
    await w.shot('offer-decline-link-desktop');
    await w.page.getByRole('button', { name: 'Decline', exact: true }).click();
    await w.page.getByRole('heading', { name: 'Thank you' }).waitFor();
    expect((await db('offers').where({ id: offer.id }).first('status')).status).toBe('declined');
    expect(w.errors).toEqual([]);
  });
});
