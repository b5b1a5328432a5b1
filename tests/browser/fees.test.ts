import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createDb } from '../../server/db/knex';
import { testConfig } from '../helpers/app';
import type { WatchedPage } from '../helpers/browser';
import { mainNav, seededServerAndBrowser, signInAs, signInAsCoordinator, switchClub } from '../helpers/session';

const suite = seededServerAndBrowser();
const db = createDb(testConfig().databaseUrl);
let clubId: number;

// The fees come from the demo seed (seeds/03-demo-spring-round.ts): a 2026 season at Mossgate Lane
// under £2.50 a m² and a £15.00 deposit, where Jonah (B-1, 3 × 6 m) has paid £20.00 of £60.00 and
// Samir (R-1, a 2.4 × 1.2 m raised bed) has paid nothing.
async function feeOf(email: string, year = 2026) {
  return db('fees as f')
    .join('users as u', 'u.id', 'f.user_id')
    .join('seasons as s', 's.id', 'f.season_id')
    .where({ 'u.email': email, 's.year': year })
    .first('f.id', 'f.club_id');
}

beforeAll(async () => {
  clubId = (await db('clubs').where({ slug: 'mossgate' }).first('id')).id;
});
afterAll(async () => {
  await db.destroy();
});

async function coordinatorAtMossgate(width: number) {
  const w = await signInAsCoordinator(suite.browser, suite.server.url, width);
  await switchClub(w.page);
  return w;
}

async function openNav(w: WatchedPage, name: string) {
  await (await mainNav(w.page)).getByRole('link', { name }).click();
}

describe('fees', () => {
  it('a coordinator records a partial payment and sees the balance go down', async () => {
    const w = await coordinatorAtMossgate(1280);
    await openNav(w, 'Fees');
    await w.page.getByRole('heading', { name: 'Fees', level: 1 }).waitFor();
    const jonah = await feeOf('jonah@example.org');
    const row = w.page.getByRole('row').filter({ hasText: 'Jonah Whitcombe' });
    // 18 m² × 2.50 + 15.00 deposit − 20.00 paid = 40.00 owed (computed).
    await row.getByText('£40.00 owed').waitFor();
    const outstanding = w.page.getByRole('region', { name: 'Totals' }).getByRole('definition').filter({ hasText: '£' });
    const before = await outstanding.nth(3).textContent();
    await w.shot('fees-1280');

    await row.getByRole('button', { name: 'Record payment for Jonah Whitcombe, plot B-1' }).click();
    await w.page.getByRole('heading', { name: 'Record payment: Jonah Whitcombe' }).waitFor();
    await expect.poll(() => w.page.getByLabel('Amount').inputValue(), { timeout: 5_000 }).toBe('40.00');
    await w.page.getByLabel('Amount').fill('15');
    await w.page.getByLabel('Method').selectOption({ label: 'Bank transfer' });
    await w.page.getByLabel('Note (optional)').fill('Second instalment');
    await w.page.getByRole('button', { name: 'Record', exact: true }).click();
    await w.page.getByText('Recorded £15.00 by bank transfer. £25.00 is still owed.').waitFor();
    await row.getByText('£25.00 owed').waitFor();
    // The totals follow: the outstanding figure drops by exactly the payment.
    const toMinor = (text: string | null) => Number((text ?? '').replace(/[^0-9]/g, ''));
    await expect.poll(async () => toMinor(before) - toMinor(await outstanding.nth(3).textContent())).toBe(1500);
    // The form now suggests what is left.
    await expect.poll(() => w.page.getByLabel('Amount').inputValue(), { timeout: 5_000 }).toBe('25.00');
    const saved = await db('payments').where({ fee_id: jonah.id }).orderBy('id');
    expect(saved).toHaveLength(2);
    expect(saved[1]).toMatchObject({ kind: 'payment', amount_minor: 1500, method: 'bank_transfer', note: 'Second instalment' });

    // More than is left, or a third decimal place, is refused before anything is sent.
    await w.page.getByLabel('Amount').fill('25.01');
    await w.page.getByRole('button', { name: 'Record', exact: true }).click();
    await w.page.getByText('At most £25.00, what is still owed').waitFor();
    await w.page.getByLabel('Amount').fill('12.345');
    await w.page.getByRole('button', { name: 'Record', exact: true }).click();
    await w.page.getByText('Use at most 2 decimal places (whole pence or cents)').waitFor();
    expect(await db('payments').where({ fee_id: jonah.id }).count()).toEqual([{ count: 2 }]);
    await w.shot('fees-payment-1280');

    await w.page.getByLabel('Show').selectOption({ label: 'Still owed' });
    await w.page.getByRole('row').filter({ hasText: 'Teodor Lind' }).waitFor({ state: 'detached' });
    await row.waitFor();
    expect(w.errors).toEqual([]);
  });

  it('the settings page shows a live example of the schedule and saves it in minor units', async () => {
    const w = await coordinatorAtMossgate(1280);
    await openNav(w, 'Settings');
    await w.page.getByRole('heading', { name: 'Settings', level: 1 }).waitFor();
    await w.page.getByText('A 3 × 6 m plot (18 m²): £45.00, concession £22.50, deposit £15.00').waitFor();
    await w.page.getByLabel('Rate per m²').fill('3.1');
    // 18 × 310 = 5580 (computed), half of it 2790.
    await w.page.getByText('A 3 × 6 m plot (18 m²): £55.80, concession £27.90, deposit £15.00').waitFor();
    await w.page.getByLabel('Charge plots').selectOption({ label: 'By kind of plot' });
    await w.page.getByLabel('Raised bed', { exact: true }).fill('25');
    await w.page.getByLabel('Charge plots').selectOption({ label: 'By area' });
    await w.shot('settings-1280');
    await w.page.getByRole('button', { name: 'Save fee schedule' }).click();
    await w.page.getByText('Fee schedule saved.').waitFor();
    expect(await db('fee_schedules').where({ club_id: clubId }).first('basis', 'rate_minor_per_area', 'price_raised_bed_minor')).toEqual({
      basis: 'area',
      rate_minor_per_area: 310,
      price_raised_bed_minor: 2500,
    });

    await w.page.getByLabel('Days to answer an offer').fill('0');
    await w.page.getByRole('button', { name: 'Save club settings' }).click();
    await w.page.getByText('At least 1 day').waitFor();
    await w.page.getByLabel('Days to answer an offer').fill('10');
    await w.page.getByLabel('When someone declines an offer').selectOption({ label: 'Take them off the waiting list' });
    await w.page.getByRole('button', { name: 'Save club settings' }).click();
    await w.page.getByText('Club settings saved.').waitFor();
    expect(await db('clubs').where({ id: clubId }).first('offer_days', 'declined_offer_policy')).toEqual({ offer_days: 10, declined_offer_policy: 'remove' });
    // Fees exist, so the currency is fixed (tests/browser/club-settings.test.ts checks the field says why).
    expect(await w.page.getByLabel('Currency').isDisabled()).toBe(true);
    expect(w.errors).toEqual([]);
  });

  it('on a phone: the coordinator reads the fees and settings, a plot holder sees their own fee at home', async () => {
    const w = await coordinatorAtMossgate(390);
    await openNav(w, 'Fees');
    await w.page.getByRole('heading', { name: 'Fees', level: 1 }).waitFor();
    await w.page.getByRole('cell', { name: 'Samir Haddad', exact: true }).waitFor();
    await w.shot('fees-390');
    await w.page.getByRole('button', { name: 'Record payment for Samir Haddad, plot R-1' }).click();
    await w.page.getByRole('heading', { name: 'Record payment: Samir Haddad' }).waitFor();
    await w.shot('fees-payment-390');
    await openNav(w, 'Settings');
    await w.page.getByRole('heading', { name: 'Plot fees' }).waitFor();
    await w.shot('settings-390');
    expect(w.errors).toEqual([]);

    const h = await signInAs(suite.browser, suite.server.url, 'samir@example.org', 390);
    await h.page.getByRole('heading', { name: 'Your fees' }).waitFor();
    const card = h.page.getByRole('listitem').filter({ hasText: 'Plot R-1, 2026 season' });
    // 2.88 m² × 2.50 = 7.20, plus the 15.00 deposit, nothing paid: 22.20 to pay (computed).
    await card.getByText('£22.20').last().waitFor();
    await card.getByText('Due by 1 Apr 2026').waitFor();
    await h.shot('club-home-fees-390');
    await h.page.goto(`${suite.server.url}/clubs/${clubId}/fees`);
    await h.page.getByRole('heading', { name: 'This page is for coordinators' }).waitFor();
    expect(h.errors).toEqual([]);
  });
});
