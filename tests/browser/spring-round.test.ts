import { afterAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { mailUrl, testConfig } from '../helpers/app';
import { openPage, type WatchedPage } from '../helpers/browser';
import { extractLink, waitForMail } from '../helpers/inbox';
import { clippedSelects, unreadablePlots } from '../helpers/clipping';
import { seededServerAndBrowser, signInAsCoordinator } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
afterAll(async () => {
  await db.destroy();
});

async function coordinatorOn(width: number): Promise<WatchedPage> {
  const w = await signInAsCoordinator(suite.browser, suite.server.url, width);
  const club = await db('clubs').where({ slug: 'mossgate' }).first('id');
  await w.page.goto(`${suite.server.url}/clubs/${club.id}/spring-round`);
  return w;
}

const plotTile = (w: WatchedPage, label: string) => w.page.locator(`[data-plot-label="${label}"]`);
/** Waits until the plot's accessible name says what a person would read on the map. */
const plotSays = (w: WatchedPage, label: string, name: string) =>
  w.page.locator(`[data-plot-label="${label}"][aria-label="${name}"]`).waitFor();

describe('the spring round in the browser', () => {
  it('opens the season, drags a waitlisted person onto a free plot, and the e-mailed accept link makes it taken', async () => {
    const w = await coordinatorOn(1280);
    await w.page.getByRole('heading', { name: 'Spring round 2026' }).waitFor();
    await w.page.getByRole('button', { name: 'Review and open the season' }).click();
    // Nothing goes until the coordinator has seen how many e-mails will go and who gets none.
    const opening = w.page.getByRole('dialog', { name: 'Open the 2027 season?' });
    await opening.waitFor();
    // The seed's 2026 holders: Teodor, Priya and Aiko have paid; Jonah still owes part of his fee and Samir has paid nothing.
    await opening.getByText('3 renewal e-mails go out as soon as you open it.').waitFor();
    await opening.getByText('3 holders of 2026 whose fee is paid').waitFor();
    await opening.getByText(/^Jonah .*, plot B-1: last season’s fee is not fully paid$/).waitFor();
    await opening.getByText(/^Samir .*, plot R-1: last season’s fee is not fully paid$/).waitFor();
    await w.shot('spring-round-open-confirm-desktop');
    expect(await db('seasons').where({ year: 2027 }).first('id')).toBeUndefined();
    await opening.getByRole('button', { name: 'Open and send 3 renewals' }).click();
    await w.page.getByRole('heading', { name: 'Spring round 2027' }).waitFor();
    // The result sits at the top, takes focus, and is read from the server, so a reload keeps it.
    const result = w.page.getByRole('status').filter({ hasText: /^The 2027 season was opened on .* by Maren Okafor: 3 renewal e-mails sent; 2 holders left out \(see why\)\.$/ });
    await result.waitFor();
    await expect.poll(() => result.evaluate((el) => el === document.activeElement)).toBe(true);
    // The next season waits for its year, so no second form with an earlier deadline is offered.
    await w.page.getByText(/^The 2027 season is already open\. The 2028 season can be opened from 1 Jan 2027\.$/).waitFor();
    expect(await w.page.getByRole('button', { name: 'Review and open the season' }).count()).toBe(0);
    await w.page.reload();
    await result.waitFor();
    await w.shot('spring-round-after-opening-desktop');
    // Jonah still owes part of his 2026 fee, so B-1 was not renewed and is free.
    await plotSays(w, 'B-1', 'Plot B-1 free');
    await expect.poll(() => plotTile(w, 'A-1').getAttribute('aria-label'), { timeout: 5_000 }).toMatch(/^Plot A-1 renewal\?, waiting for Teodor Lind/);
    await w.shot('spring-round-opened-desktop');

    await w.page.getByRole('heading', { name: 'Left out of the 2027 renewals' }).waitFor();
    const since = Date.now();
    const person = w.page.getByRole('button', { name: /^1 Ines Carvalho/ });
    await plotTile(w, 'A-3').scrollIntoViewIfNeeded();
    const from = (await person.boundingBox())!;
    const to = (await plotTile(w, 'A-3').boundingBox())!;
    const mapTop = () => w.page.getByRole('group', { name: 'Spring round map of Mossgate Lane' }).evaluate((el) => el.getBoundingClientRect().top + window.scrollY);
    const topBefore = await mapTop();
    await w.page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
    await w.page.mouse.down();
    await w.page.mouse.move(from.x + from.width / 2 - 20, from.y + from.height / 2, { steps: 5 });
    await w.page.mouse.move(to.x + to.width / 2, to.y + to.height / 2, { steps: 15 });
    await w.page.locator('[data-plot-label="A-3"][data-drop-over="true"]').waitFor();
    await w.page.mouse.up();
    // Nothing is sent on the drop: a confirm step says who, which plot, by when and what it costs.
    const confirm = w.page.getByRole('dialog', { name: 'Offer plot A-3 to Ines Carvalho?' });
    await confirm.waitFor();
    await confirm.getByText('£45.00 plus a refundable deposit of £15.00').waitFor();
    await confirm.getByText('(7 days)', { exact: false }).waitFor();
    await w.shot('spring-round-offer-confirm-desktop');
    expect(await db('offers').count({ n: '*' }).first()).toEqual({ n: 0 });
    const saved = w.page.waitForResponse((r) => r.url().includes('/offers') && r.request().method() === 'POST');
    await confirm.getByRole('button', { name: 'Send the offer' }).click();
    expect((await saved).status()).toBe(201);
    await w.page.getByText('Plot A-3 offered to Ines Carvalho. The offer e-mail is on its way.').waitFor();
    // The notice does not push the map down.
    expect(await mapTop()).toBe(topBefore);
    await plotSays(w, 'A-3', 'Plot A-3 offered, to Ines Carvalho');
    await w.shot('spring-round-offered-desktop');

    const mail = await waitForMail(mailUrl(), { to: 'ines@example.org', after: since });
    expect(mail.subject).toMatch(/^A plot for you at Mossgate Community Garden Club: A-3/);
    // Two links: one to accept, one to decline, each opening its own confirm page.
    const link = extractLink(mail, 'answer=accept');
    expect(extractLink(mail, 'answer=decline')).not.toBe(link);
    const applicant = await openPage(suite.browser, 390);
    await applicant.page.goto(link.replace(/^http:\/\/127\.0\.0\.1:\d+/, suite.server.url));
    await applicant.page.getByRole('heading', { name: 'Accept this plot?' }).waitFor();
    expect(await applicant.page.getByRole('button', { name: 'Decline' }).count()).toBe(0);
    await applicant.page.getByText('£45.00 plus a refundable deposit of £15.00').waitFor();
    await applicant.shot('offer-link-phone');
    await applicant.page.getByRole('button', { name: 'Accept the plot' }).click();
    await applicant.page.getByText('Plot A-3 is yours for 2027.', { exact: false }).waitFor();
    await applicant.shot('offer-accepted-phone');

    await w.page.reload();
    await plotSays(w, 'A-3', 'Plot A-3 IC, held by Ines Carvalho');
    expect(w.errors).toEqual([]);
    expect(applicant.errors).toEqual([]);
  }, 60_000);

  it('lists the holder left out for owing, and renews him from the page once he has paid', async () => {
    const w = await coordinatorOn(1280);
    await w.page.getByRole('heading', { name: 'Left out of the 2027 renewals' }).waitFor();
    // Jonah paid £20.00 of £60.00 for 2026 (demo data): £40.00 owed (computed).
    await w.page.getByText('Last season’s fee is not fully paid (£40.00 owed)').waitFor();
    expect(await w.page.getByRole('button', { name: /^Send Jonah .* a renewal$/ }).count()).toBe(0);

    const jonah = await db('users').where({ email: 'jonah@example.org' }).first('id');
    const fee = await db('fees as f').join('seasons as s', 's.id', 'f.season_id').where({ 'f.user_id': jonah.id, 's.year': 2026 }).first('f.id');
    await db('payments').insert({ fee_id: fee.id, amount_minor: 4000, method: 'cash', paid_on: '2026-12-01' });
    await w.page.reload();
    await w.page.getByText('Paid since the season opened: a renewal can be sent now').waitFor();
    const since = Date.now();
    await w.page.getByRole('button', { name: /^Send Jonah .* a renewal$/ }).click();
    await w.page.getByText(/^Renewal for plot B-1 sent to Jonah/).waitFor();
    const mail = await waitForMail(mailUrl(), { to: 'jonah@example.org', after: since });
    expect(mail.subject).toMatch(/^Keep plot B-1 for 2027\?/);
    await w.shot('spring-round-late-renewal-desktop');
    expect(w.errors).toEqual([]);
  });

  it('takes the free plot under the pointer as the drop target, and Cancel sends nothing', async () => {
    const w = await coordinatorOn(1280);
    await w.page.getByRole('heading', { name: 'Spring round 2027' }).waitFor();
    const offersBefore = await db('offers').count({ n: '*' }).first();
    const free = w.page.locator('[data-plot-label][aria-label$=" free"]');
    await free.first().waitFor();
    const free_ = await free.evaluateAll((els) => els.map((e) => e.getAttribute('data-plot-label')!));
    expect(free_.length).toBeGreaterThan(1);
    // One drop per page: the second free plot, so free plots lie on both sides of the pointer's path.
    const labels = free_.slice(1, 2);
    // Scroll a little first, so drop zones measured before a scroll would be off.
    await w.page.evaluate(() => window.scrollBy(0, 120));
    for (const label of labels) {
      const person = w.page.getByRole('button', { name: /^2 / });
      const from = (await person.boundingBox())!;
      const to = (await plotTile(w, label).boundingBox())!;
      // Let go near the plot's lower-right corner: the dragged chip then hangs over plots to its left and above.
      const x = to.x + to.width * 0.85;
      const y = to.y + to.height * 0.85;
      await w.page.mouse.move(from.x + from.width / 2, from.y + from.height / 2);
      await w.page.mouse.down();
      await w.page.mouse.move(from.x + from.width / 2 - 20, from.y + from.height / 2, { steps: 5 });
      await w.page.mouse.move(x, y, { steps: 20 });
      // As a person does: see the plot under the pointer light up, then let go.
      await w.page.locator(`[data-plot-label="${label}"][data-drop-over="true"]`).waitFor();
      await w.page.mouse.up();
      const confirm = w.page.getByRole('dialog', { name: new RegExp(`^Offer plot ${label} to `) });
      await confirm.waitFor();
      await confirm.getByRole('button', { name: 'Cancel' }).click();
      await confirm.waitFor({ state: 'hidden' });
      // The native dialog leaves the top layer a moment after its content goes; until then it takes the pointer.
      await w.page.waitForFunction(() => !document.querySelector('dialog[open]'));
    }
    expect(await db('offers').count({ n: '*' }).first()).toEqual(offersBefore);
    expect(w.errors).toEqual([]);
  });

  it('offers a plot without dragging: select the plot, take the suggested person, press Offer', async () => {
    const w = await coordinatorOn(390);
    await w.page.getByRole('heading', { name: 'Spring round 2027' }).waitFor();
    // R-1 is a wheelchair-height raised bed freed this season; Grace asked for exactly that.
    await plotTile(w, 'R-1').click();
    await w.page.getByText('For plot R-1, the next who fits is Grace Adeyemi.').waitFor();
    await w.page.getByRole('button', { name: 'Offer plot R-1' }).click();
    const confirm = w.page.getByRole('dialog', { name: 'Offer plot R-1 to Grace Adeyemi?' });
    await confirm.waitFor();
    await w.shot('spring-round-offer-confirm-phone');
    const saved = w.page.waitForResponse((r) => r.url().includes('/offers') && r.request().method() === 'POST');
    await confirm.getByRole('button', { name: 'Send the offer' }).click();
    expect((await saved).status()).toBe(201);
    await plotSays(w, 'R-1', 'Plot R-1 offered, to Grace Adeyemi');
    await w.shot('spring-round-phone');
    // Nothing on the page is wider than the phone.
    expect(await w.page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(390);
    const offer = await db('offers as o').join('applications as a', 'a.id', 'o.application_id').where('a.name', 'Grace Adeyemi').first('o.status');
    expect(offer.status).toBe('pending');
    expect(w.errors).toEqual([]);
  });

  // Follows the test above, which offered R-1 to Grace Adeyemi (the file's tests share one seeded server).
  it('withdraws an open offer from the map: the plot is free again and the person is back on the list', async () => {
    const w = await coordinatorOn(1280);
    await w.page.getByRole('heading', { name: 'Spring round 2027' }).waitFor();
    await plotSays(w, 'R-1', 'Plot R-1 offered, to Grace Adeyemi');
    // The map renders only once the waitlist has loaded too, so this count is not a race: while
    // her offer is open she is not among the people waiting.
    expect(await w.page.getByRole('button', { name: /^\d+ Grace Adeyemi/ }).count()).toBe(0);
    await plotTile(w, 'R-1').click();
    await w.page.getByRole('heading', { name: 'Plot R-1: Offered' }).waitFor();
    await w.page.getByText('Offered to Grace Adeyemi, answer by', { exact: false }).waitFor();
    const withdrawn = w.page.waitForResponse((r) => r.url().includes('/withdraw') && r.request().method() === 'POST');
    await w.page.getByRole('button', { name: 'Withdraw offer' }).click();
    expect((await withdrawn).status()).toBe(204);
    await w.page.getByRole('status').getByText('Offer withdrawn.').waitFor();
    await plotSays(w, 'R-1', 'Plot R-1 free');
    await w.page.getByRole('heading', { name: 'Plot R-1: Free' }).waitFor();
    // She is waiting again, so the waitlist shows her and she is the one suggested for the bed once more.
    await w.page.getByRole('button', { name: /^\d+ Grace Adeyemi/ }).waitFor();
    await w.page.getByText('For plot R-1, the next who fits is Grace Adeyemi.').waitFor();
    await w.page.getByRole('button', { name: 'Offer plot R-1' }).waitFor();
    await w.shot('spring-round-withdrawn-desktop');
    const offer = await db('offers as o').join('applications as a', 'a.id', 'o.application_id').where('a.name', 'Grace Adeyemi').first('o.status', 'a.status as applicationStatus');
    expect(offer).toEqual({ status: 'withdrawn', applicationStatus: 'waiting' });
    expect(w.errors).toEqual([]);
  });
  for (const width of [1280, 390]) {
    it(`shows the offer select and every small plot's status word in full at ${width} px`, async () => {
      const w = await coordinatorOn(width);
      await w.page.getByRole('heading', { name: /^Spring round \d{4}$/ }).waitFor();
      await plotTile(w, 'K-1').click();
      await w.page.getByRole('heading', { name: /^Plot K-1: / }).waitFor();
      expect.soft(await clippedSelects(w.page)).toEqual([]);
      const small = (await db('plots as p').join('sites as s', 's.id', 'p.site_id').where({ 's.name': 'Mossgate Lane' }).whereIn('p.kind', ['container', 'raised_bed']).whereNull('p.deleted_at').select('p.label')).map((r) => r.label as string);
      expect(small.length).toBe(9); // seeds: 6 raised beds and 3 containers on Mossgate Lane
      expect.soft(await unreadablePlots(w.page, small)).toEqual([]);
      await w.shot(`allocation-map-${width}`);
      expect(w.errors).toEqual([]);
    });
  }
});
