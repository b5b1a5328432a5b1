import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { mailUrl, testConfig } from '../helpers/app';
import { openPage } from '../helpers/browser';
import { extractLink, waitForMail } from '../helpers/inbox';
import { seededServerAndBrowser, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

describe('invites on the members page', () => {
  it('an expired invite is still listed and can be sent again with a new link', async () => {
    const w = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/members`);
    const form = w.page.locator('form').filter({ has: w.page.getByRole('group', { name: 'Roles' }) });
    await form.getByLabel('Name').fill('Ivy Resent');
    await form.getByLabel('E-mail').fill('ivy.resent@example.org');
    await form.getByLabel('Volunteer').check();
    const since = Date.now();
    await form.getByRole('button', { name: /invite/i }).click();
    const first = extractLink(await waitForMail(mailUrl(), { to: 'ivy.resent@example.org', after: since }), '/invite');
    await db('invites').where({ email: 'ivy.resent@example.org' }).update({ expires_at: new Date(Date.now() - 24 * 3600 * 1000) });

    await w.page.reload();
    const row = w.page.getByRole('row').filter({ hasText: 'ivy.resent@example.org' });
    await row.getByText(/^Expired /).waitFor();
    const resentAt = Date.now();
    await row.getByRole('button', { name: 'Send again ivy.resent@example.org' }).click();
    await row.getByText(/^Sent again; the new link works until \d{1,2} [A-Z][a-z]{2} \d{4}\.$/).waitFor();
    const second = extractLink(await waitForMail(mailUrl(), { to: 'ivy.resent@example.org', after: resentAt }), '/invite');
    expect(second).not.toBe(first);
    // Saved: after a reload the row no longer says expired.
    await w.page.reload();
    await row.waitFor();
    expect(await row.getByText(/^Expired /).count()).toBe(0);
    await w.shot('members-invite-resent-desktop');
    // On a phone the row's actions are reachable by scrolling the table, and the page itself does not scroll sideways.
    await w.page.setViewportSize({ width: 390, height: 844 });
    await row.getByRole('button', { name: 'Send again ivy.resent@example.org' }).scrollIntoViewIfNeeded();
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('members-invites-phone');

    // The first e-mail's link, opened by the invitee on a phone, says it was replaced.
    const ivy = await openPage(suite.browser, 390);
    await ivy.page.goto(first.replace(/^http:\/\/127\.0\.0\.1:\d+/, suite.server.url));
    await ivy.page.getByText('This link was replaced by a newer invitation e-mail. Use the link in the latest one.').waitFor();
    await ivy.shot('invite-link-replaced-phone');
    expect(w.errors).toEqual([]);
    // The browser logs the 410 answer itself; nothing else may be logged.
    expect(ivy.errors.filter((e) => !e.includes('410'))).toEqual([]);
  }, 60_000);
});
