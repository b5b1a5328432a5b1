import { afterAll, describe, expect, it } from 'vitest';
import type { Page } from 'playwright-core';
import { createDb } from '../../server/db/knex';
import { mailUrl, testConfig } from '../helpers/app';
import { openPage } from '../helpers/browser';
import { waitForMail } from '../helpers/inbox';
import { mainNav, seededServerAndBrowser, signInAs, signInAsCoordinator, switchClub } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

async function fillApplication(page: Page, p: { name: string; email: string; raised?: boolean; accessible?: boolean }) {
  await page.goto(`${suite.server.url}/apply/mossgate`);
  await page.getByRole('heading', { name: 'Apply for a plot' }).waitFor();
  await page.getByLabel('Your name').fill(p.name);
  await page.getByLabel('E-mail').fill(p.email);
  await page.getByLabel('Phone (optional)').fill('01632 960123');
  await page.getByLabel('Size of plot you would like').selectOption('small');
  if (p.raised) await page.getByLabel('A raised bed').check();
  if (p.accessible) await page.getByLabel('A wheelchair-accessible bed').check();
}

const coordinator = (width: number) => signInAsCoordinator(suite.browser, suite.server.url, width);

/** A plot holder of the demo club, signed in and on its home page. */
async function teodorOn(width: number) {
  const w = await signInAs(suite.browser, suite.server.url, 'teodor@example.org', width);
  await w.page.getByRole('heading', { name: 'Mossgate Community Garden Club' }).waitFor();
  return w;
}

describe('applying for a plot and the waitlist', () => {
  it('a person fills the public form on a phone and sees their place on the waitlist', async () => {
    const w = await openPage(suite.browser, 390);
    await fillApplication(w.page, { name: 'Pat Newcomer', email: 'pat.newcomer@example.org', raised: true });
    // The club's notes on fees and waiting (club settings, set in the demo data) are on the form.
    const notes = await db('clubs').where({ slug: 'mossgate' }).first('fee_note', 'typical_wait');
    const facts = w.page.locator('dl').filter({ hasText: 'What a plot costs' });
    await facts.getByText(notes.fee_note, { exact: true }).waitFor();
    await facts.getByText(notes.typical_wait, { exact: true }).waitFor();
    expect(notes.fee_note).toContain('£');
    await w.page.getByLabel('Preferred site (optional)').selectOption({ index: 1 });
    // The honeypot is out of sight and out of the tab order.
    const honeypot = w.page.locator('input[tabindex="-1"][autocomplete="off"]');
    expect(await honeypot.count()).toBe(1);
    expect(await honeypot.isVisible()).toBe(true); // rendered, but placed off-screen
    const box = (await honeypot.boundingBox())!;
    expect(box.x + box.width).toBeLessThan(0);
    await w.shot('apply-form-phone');

    const after = Date.now();
    await w.page.getByRole('button', { name: 'Join the waiting list' }).click();
    await w.page.getByRole('heading', { name: "You're on the waiting list" }).waitFor();
    const stored = await db('applications as a')
      .join('clubs as c', 'c.id', 'a.club_id')
      .where({ 'c.slug': 'mossgate', 'a.email': 'pat.newcomer@example.org' })
      .first('a.id', 'a.needs_raised', 'a.preferred_site_id', 'a.club_id');
    expect(stored).toMatchObject({ needs_raised: true });
    expect(stored.preferred_site_id).not.toBeNull();
    const position = Number(
      (await db('applications').where({ club_id: stored.club_id, status: 'waiting' }).count({ n: '*' }))[0].n,
    );
    await w.page.getByText(`You are number ${position} on the waiting list`).waitFor();
    await w.page.getByText(String(position), { exact: true }).waitFor();
    const mail = await waitForMail(mailUrl(), { to: 'pat.newcomer@example.org', after });
    expect(mail.text).toContain(`You are number ${position} on the waiting list`);
    // Nothing wider than the phone's screen.
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('apply-received-phone');
    expect(w.errors).toEqual([]);
  });

  it('shows the same form on a wide screen', async () => {
    const w = await openPage(suite.browser, 1280);
    await fillApplication(w.page, { name: 'Robin Second', email: 'robin.second@example.org', accessible: true });
    await w.shot('apply-form-desktop');
    await w.page.getByRole('button', { name: 'Join the waiting list' }).click();
    await w.page.getByRole('heading', { name: "You're on the waiting list" }).waitFor();
    expect(w.errors).toEqual([]);
  });

  it('the coordinator sees them on the waitlist and moves one up with a reason', async () => {
    const w = await coordinator(1280);
    await switchClub(w.page);
    await (await mainNav(w.page)).getByRole('link', { name: 'Waiting list' }).click();
    await w.page.getByRole('heading', { name: 'Waiting list', exact: true }).waitFor();
    await w.page.getByRole('cell', { name: /^Pat Newcomer/ }).waitFor();
    await w.page.getByRole('cell', { name: /^Robin Second/ }).waitFor();
    const link = await w.page.getByLabel('Application form for people who want a plot').inputValue();
    expect(link).toBe(`${suite.server.url}/apply/mossgate`);
    await w.shot('waitlist-desktop');

    const robinRow = w.page.getByRole('row', { name: /Robin Second/ });
    const robinBefore = Number(await robinRow.getByRole('cell').first().innerText());
    await w.page.getByRole('button', { name: 'Move Robin Second', exact: true }).click();
    const dialog = w.page.getByRole('dialog', { name: 'Move Robin Second' });
    await dialog.getByLabel('New place').fill('1');
    await dialog.getByRole('button', { name: 'Move', exact: true }).click();
    await dialog.getByText('Give a reason (it is kept in the record)').waitFor();
    await dialog.getByLabel('Reason').fill('Needs the accessible bed by the gate');
    await w.shot('waitlist-move-dialog-desktop');
    await dialog.getByRole('button', { name: 'Move', exact: true }).click();
    await w.page.getByText('Robin Second is now number 1.').waitFor();
    await expect.poll(() => robinRow.getByRole('cell').first().innerText(), { timeout: 5_000 }).toBe('1');
    expect(robinBefore).toBeGreaterThan(1);
    const move = await db('waitlist_moves').orderBy('id', 'desc').first();
    expect(move).toMatchObject({ from_position: robinBefore, to_position: 1, reason: 'Needs the accessible bed by the gate' });

    await w.page.getByRole('combobox', { name: 'Needs' }).selectOption('raised');
    await w.page.getByRole('cell', { name: /^Robin Second/ }).waitFor({ state: 'detached' });
    await w.page.getByRole('cell', { name: /^Pat Newcomer/ }).waitFor();
    expect(w.errors).toEqual([]);
  });

  it('the waitlist and messages pages work on a phone, and a message goes out to the club', async () => {
    const w = await coordinator(390);
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/waitlist`);
    await w.page.getByRole('cell', { name: /^Pat Newcomer/ }).waitFor();
    await w.shot('waitlist-phone');
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    // The row's actions are on screen where a thumb reaches them, not off to the right of a sideways scroll box.
    const move = w.page.getByRole('button', { name: /^Move Pat Newcomer/ });
    await move.scrollIntoViewIfNeeded();
    const box = (await move.boundingBox())!;
    expect(box.x).toBeGreaterThanOrEqual(0);
    expect(box.x + box.width).toBeLessThanOrEqual(390);
    await w.page.mouse.click(box.x + box.width / 2, box.y + box.height / 2);
    const dialog = w.page.getByRole('dialog', { name: /^Move Pat Newcomer/ });
    await dialog.waitFor();
    await dialog.getByRole('button', { name: 'Close' }).click();
    await w.page.waitForFunction(() => !document.querySelector('dialog[open]'));

    const ben = await db('users').where({ email: 'ben@example.org' }).first('id');
    await db('mail_preferences').insert({ user_id: ben.id, club_id: club.id, topic: 'club_news', is_subscribed: false });
    await (await mainNav(w.page)).getByRole('link', { name: 'Messages' }).click();
    await w.page.getByRole('heading', { name: 'Messages', exact: true }).waitFor();
    await w.page.getByLabel('Subject').fill('Work morning on Saturday');
    await w.page.getByLabel('Message', { exact: true }).fill('Bring gloves.\n\nTea from ten.');
    await w.page.getByRole('button', { name: 'Review and send' }).click();
    await w.page.getByText('goes to everyone in the club').waitFor();
    // The confirm step says how many people it reaches before anything is sent: every member but Ben, who opted out.
    const members = await db('memberships').where({ club_id: club.id }).countDistinct({ n: 'user_id' });
    const reach = Number(members[0].n) - 1;
    await w.page.getByText(`It will reach ${reach} people; 1 turned club news off and will be skipped.`).waitFor();
    await w.shot('messages-confirm-phone');
    const after = Date.now();
    await w.page.getByRole('button', { name: `Send to ${reach} people` }).click();
    await w.page.getByText(`On its way to ${reach} of ${reach} people`).waitFor();
    await w.page.setViewportSize({ width: 1280, height: 860 });
    await w.shot('messages-desktop');
    await w.page.setViewportSize({ width: 390, height: 860 });
    await w.page.getByRole('cell', { name: 'Work morning on Saturday' }).waitFor();
    const mail = await waitForMail(mailUrl(), { to: 'teodor@example.org', subject: 'Work morning on Saturday', after });
    expect(mail.to).toEqual(['teodor@example.org']);
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await w.shot('messages-phone');
    expect(w.errors).toEqual([]);
  });

  it('the coordinator checks a members file, sees the bad row, fixes it and imports', async () => {
    for (const width of [390, 1280]) {
      const w = await coordinator(width);
      const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
      await w.page.goto(`${suite.server.url}/clubs/${club.id}/members`);
      await w.page.getByRole('heading', { name: 'Import and download' }).waitFor();
      const suffix = width === 390 ? 'phone' : 'desktop';
      const bad = ['name,email,roles', `Wren ${suffix},wren.${suffix}@example.org,plot_holder`, `Ash ${suffix},not-an-address,volunteer`].join('\n');
      await w.page.getByLabel('Member rows').fill(bad);
      await w.page.getByRole('button', { name: 'Check file' }).click();
      await w.page.getByText('Row 3, email: Enter a valid e-mail address').waitFor();
      await expect(w.page.getByRole('button', { name: /^Import/ }).isDisabled()).resolves.toBe(true);
      expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
      await w.shot(`members-import-${suffix}`);

      await w.page.getByLabel('Member rows').fill(bad.replace('not-an-address', `ash.${suffix}@example.org`));
      await w.page.getByRole('button', { name: 'Check file' }).click();
      await w.page.getByRole('button', { name: 'Import 2 people' }).click();
      await w.page.getByText('Imported 2 people (2 new).').waitFor();
      await w.page.getByLabel('Filter members').fill(`Wren ${suffix}`);
      await w.page.getByRole('cell', { name: `Wren ${suffix}`, exact: true }).waitFor();
      expect(await db('users').where({ email: `ash.${suffix}@example.org` }).first('password_hash')).toEqual({ password_hash: null });
      expect(w.errors).toEqual([]);
    }
  });

  it('a plot holder turns club news off from the link beside their name', async () => {
    const w = await teodorOn(1280);
    await w.page.getByRole('link', { name: 'E-mail choices' }).click();
    await w.page.getByRole('heading', { name: 'E-mail choices' }).waitFor();
    const box = w.page.getByLabel('Club news from the coordinator');
    await box.waitFor();
    await expect.poll(() => box.isChecked(), { timeout: 5_000 }).toBe(true);
    await box.uncheck();
    await w.page.getByRole('button', { name: 'Save my choice' }).click();
    await w.page.getByText('Saved. Your choice applies to Mossgate Community Garden Club only.').waitFor();
    const teodor = await db('users').where({ email: 'teodor@example.org' }).first('id');
    expect(await db('mail_preferences').where({ user_id: teodor.id, topic: 'club_news' }).first('is_subscribed')).toEqual({
      is_subscribed: false,
    });
    await w.shot('email-choices-desktop');
    expect(w.errors).toEqual([]);

    const phone = await teodorOn(390);
    await phone.page.getByRole('button', { name: /menu/i }).click();
    await phone.page.getByRole('link', { name: 'E-mail choices' }).click();
    await phone.page.getByRole('heading', { name: 'E-mail choices' }).waitFor();
    await phone.page.getByLabel('Club news from the coordinator').waitFor();
    await expect.poll(() => phone.page.getByLabel('Club news from the coordinator').isChecked(), { timeout: 5_000 }).toBe(false);
    expect(await phone.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    await phone.shot('email-choices-phone');
    expect(phone.errors).toEqual([]);
  });
});
