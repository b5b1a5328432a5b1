import { afterAll, describe, expect, it } from 'vitest';
import type { Locator, Page } from 'playwright-core';
import { localToday } from '@shared/dates';
import { createDb } from '../../server/db/knex';
import { mailUrl, testConfig } from '../helpers/app';
import { axeViolations } from '../helpers/axe';
import { openPage } from '../helpers/browser';
import { extractLink, waitForMail } from '../helpers/inbox';
import { DEMO_CLUB, seededServerAndBrowser, signInAs, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

/** Presses and lets go of a control with the mouse at its middle, as a finger or a pointer does. */
async function press(page: Page, control: Locator) {
  await control.scrollIntoViewIfNeeded();
  const box = (await control.boundingBox())!;
  await page.mouse.move(box.x + box.width / 2, box.y + box.height / 2);
  await page.mouse.down();
  await page.mouse.up();
}

const sideScroll = (page: Page) => page.evaluate(() => document.documentElement.scrollWidth);

/** The link of a message, opened on this test's server (the path and query are what count). */
const onServer = (link: string) => {
  const url = new URL(link);
  return `${suite.server.url}${url.pathname}${url.search}`;
};

// The demo (seeds/07) has the coming weeks' winter shifts at Mossgate Lane; Lucía holds one place on the
// first compost morning (2 places), and Wren Osei volunteers without a password.
describe('a volunteer’s shift, from the e-mail', () => {
  it('the coordinator asks for help; Wren, with no account, takes the place from the e-mail on a phone, and marks it done from the next one', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const shift = await db('shifts').where({ club_id: club.id }).where('title', 'like', '%garden jobs%').where('starts_at', '>', new Date()).orderBy('starts_at').first('id', 'title', 'on_date');
    const wren = await db('users').where({ email: 'wren@example.org' }).first('id');

    // The coordinator at 1280 px: the shift page, Ask for help by e-mail.
    const c = await signInAsCoordinator(suite.browser, suite.server.url, 1280);
    await c.page.goto(`${suite.server.url}/clubs/${club.id}/shifts/${shift.id}`);
    await c.page.getByRole('heading', { level: 1, name: shift.title }).waitFor();
    await c.page.getByText('Lucía Ferreira').waitFor();
    const since = Date.now();
    await press(c.page, c.page.getByRole('button', { name: 'Ask for help by e-mail' }));
    const dialog = c.page.getByRole('dialog', { name: 'Ask for help by e-mail' });
    await dialog.getByLabel('A note from you (optional)').fill('The compost needs two pairs of hands.');
    await press(c.page, dialog.getByRole('button', { name: 'Send the e-mails' }));
    // Priya, Ben and Wren get one (Lucía holds a place, and she turned calls for help off anyway).
    await c.page.getByText('Sent to 3 volunteers.').waitFor();
    expect({ violations: await axeViolations(c.page) }).toEqual({ violations: [] });

    // Wren on a phone, signed in nowhere, opens the link from the fake inbox.
    const mail = await waitForMail(mailUrl(), { to: 'wren@example.org', subject: 'Help wanted', after: since });
    expect(mail.text).toContain('The compost needs two pairs of hands.');
    expect(mail.text).toMatch(/Take care: .*gloves/i);
    const w = await openPage(suite.browser, 390);
    await w.page.goto(onServer(extractLink(mail, '/shift-link?token=')));
    await w.page.getByRole('heading', { name: 'Take this shift?' }).waitFor();
    await w.page.getByText(DEMO_CLUB).first().waitFor();
    await w.page.getByText(/This link is for Wren/).waitFor();
    // Opening the link took nothing.
    expect(await db('shift_claims').where({ shift_id: shift.id, user_id: wren.id }).first()).toBeUndefined();
    expect(await sideScroll(w.page)).toBeLessThanOrEqual(390);
    await w.shot('shift-link-claim-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });

    const confirmSince = Date.now();
    await press(w.page, w.page.getByRole('button', { name: 'Yes, I\'ll take this shift' }));
    await w.page.getByRole('heading', { name: 'It\'s yours' }).waitFor();
    const claim = await db('shift_claims').where({ shift_id: shift.id, user_id: wren.id }).first('status', 'via');
    expect(claim).toEqual({ status: 'taken', via: 'link' });
    await w.shot('shift-link-taken-phone');

    // The confirmation e-mail: a calendar file, and the done link.
    const taken = await waitForMail(mailUrl(), { to: 'wren@example.org', subject: 'You have a place', after: confirmSince });
    expect(taken.attachments.map((a) => a.contentType)).toEqual([expect.stringMatching(/^text\/calendar/)]);
    const links = [...taken.text.matchAll(/(https?:\/\/\S+\/shift-link\?token=\S+)/g)].map((m) => m[1]);
    expect(links).toHaveLength(2);

    // The coordinator's calendar shows the shift covered now (2 of 2 places).
    await c.page.goto(`${suite.server.url}/clubs/${club.id}/shifts?view=calendar&date=${shift.on_date}`);
    await c.page.getByText(new RegExp(`^Covered: ${shift.title.replace(/[()]/g, '.')}`)).first().waitFor();
    await c.shot('shift-calendar-desktop');
    expect({ violations: await axeViolations(c.page) }).toEqual({ violations: [] });

    // The shift's day comes: here its date is moved to today (the demo's shifts are all still to come).
    await db('shifts').where({ id: shift.id }).update({ on_date: localToday('Europe/London') });
    await w.page.goto(onServer(links[1]));
    await w.page.getByRole('button', { name: 'Mark the shift done' }).waitFor();
    await w.page.getByLabel('A note for the coordinator (optional)').fill('Both bays turned, leaves added.');
    await w.page.getByLabel('Hours you worked').fill('1.5');
    await press(w.page, w.page.getByRole('button', { name: 'Mark the shift done' }));
    await w.page.getByRole('heading', { name: 'Thank you' }).waitFor();
    const done = await db('shift_claims').where({ shift_id: shift.id, user_id: wren.id }).first('status', 'hours', 'note');
    expect([done.status, Number(done.hours), done.note]).toEqual(['done', 1.5, 'Both bays turned, leaves added.']);
    const tasks = await db('tasks').whereIn('id', db('shift_tasks').where({ shift_id: shift.id }).select('task_id')).pluck('status');
    expect(tasks.length).toBeGreaterThan(0);
    expect(tasks.every((s: string) => s === 'done')).toBe(true);
    expect(await sideScroll(w.page)).toBeLessThanOrEqual(390);
    await w.shot('shift-link-done-phone');
    expect(w.errors).toEqual([]);
    expect(c.errors).toEqual([]);
  }, 120_000);

  it('a signed-in volunteer on a phone takes a place on the board and finds it in My shifts', async () => {
    const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
    const w = await signInAs(suite.browser, suite.server.url, 'priya@example.org', 390);
    await w.page.getByRole('heading', { name: DEMO_CLUB }).waitFor();
    const mulch = await db('shifts').where({ club_id: club.id, kind: 'mulch' }).first('id', 'title', 'on_date');
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/shifts?kind=mulch&date=${mulch.on_date}`);
    const take = w.page.getByRole('button', { name: `Take a place on ${mulch.title}` });
    await take.waitFor();
    expect(await sideScroll(w.page)).toBeLessThanOrEqual(390);
    await w.shot('shift-board-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    await press(w.page, take);
    await w.page.getByRole('button', { name: `Give back my place on ${mulch.title}` }).waitFor();
    const priya = await db('users').where({ email: 'priya@example.org' }).first('id');
    expect((await db('shift_claims').where({ shift_id: mulch.id, user_id: priya.id }).first('status', 'via'))).toEqual({ status: 'taken', via: 'board' });
    await w.page.goto(`${suite.server.url}/clubs/${club.id}/my-shifts`);
    await w.page.getByText(mulch.title).first().waitFor();
    expect(await sideScroll(w.page)).toBeLessThanOrEqual(390);
    await w.shot('my-shifts-phone');
    expect({ violations: await axeViolations(w.page) }).toEqual({ violations: [] });
    expect(w.errors).toEqual([]);
  }, 90_000);
});
