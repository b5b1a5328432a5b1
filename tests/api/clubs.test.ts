import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

async function signedIn(person: { email: string; password: string | null }) {
  const c = await browserLikeAgent(t.app);
  expect((await c.signIn(person.email, person.password!)).status).toBe(200);
  return c;
}

async function club() {
  const row = await buildClub(t.db, { name: 'Allotment Row' });
  const coord = await buildMember(t.db, { clubId: row.id, roles: ['coordinator'] });
  const holder = await buildMember(t.db, { clubId: row.id, roles: ['plot_holder'] });
  return { club: row, c: await signedIn(coord), holder };
}

describe('club settings', () => {
  it("shows any member the club's settings with the defaults from the migration", async () => {
    const { club: row, holder } = await club();
    const h = await signedIn(holder);
    const res = await h.get(`/api/clubs/${row.id}`).expect(200);
    expect(res.body).toEqual({
      id: row.id,
      name: 'Allotment Row',
      slug: row.slug,
      currency: 'GBP',
      offerDays: 7,
      renewalDays: 14,
      declinedOfferPolicy: 'end_of_list',
      allowMultipleOffers: false,
      // A club with no site yet keeps the default zone (the migration's default).
      timeZone: 'UTC',
      // The migration adds these empty; no fee is recorded yet.
      contactEmail: null,
      feeNote: null,
      typicalWait: null,
      // The crop notes migration's defaults: a 3-year gap (shared/crops/rotation.ts, after WVU), books private.
      rotationGapYears: 3,
      sharesPlotBooks: false,
      // Our own starting factors (migrations/20261203000200_tasks.ts), not published figures.
      raisedBedWaterFactor: 1.2,
      containerWaterFactor: 1.5,
      volunteerHoursRequired: null,
      currencyLocked: false,
    });
    const outsider = await signedIn(await buildMember(t.db, { roles: ['coordinator'] }));
    expect((await outsider.get(`/api/clubs/${row.id}`)).status).toBe(403);
    expect((await (await browserLikeAgent(t.app)).get(`/api/clubs/${row.id}`)).status).toBe(401);
  });

  it('lets a coordinator change the name and rules, and only what was sent', async () => {
    const { club: row, c } = await club();
    const res = await c.patch(`/api/clubs/${row.id}`, { name: '  Allotment Row Growers ', offerDays: 10, declinedOfferPolicy: 'remove' }).expect(200);
    expect(res.body).toMatchObject({ name: 'Allotment Row Growers', offerDays: 10, renewalDays: 14, declinedOfferPolicy: 'remove', currency: 'GBP' });
    await c.patch(`/api/clubs/${row.id}`, { currency: 'EUR', renewalDays: 21, allowMultipleOffers: true }).expect(200);
    expect(await t.db('clubs').where({ id: row.id }).first('name', 'currency', 'offer_days', 'renewal_days', 'declined_offer_policy', 'allow_multiple_offers')).toEqual({
      name: 'Allotment Row Growers',
      currency: 'EUR',
      offer_days: 10,
      renewal_days: 21,
      declined_offer_policy: 'remove',
      allow_multiple_offers: true,
    });
    const rotation = await c.patch(`/api/clubs/${row.id}`, { rotationGapYears: 4, sharesPlotBooks: true }).expect(200);
    expect(rotation.body).toMatchObject({ rotationGapYears: 4, sharesPlotBooks: true, offerDays: 10 });
    expect(await t.db('clubs').where({ id: row.id }).first('rotation_gap_years', 'shares_plot_books')).toEqual({ rotation_gap_years: 4, shares_plot_books: true });
    // The session lists the club under its new name.
    expect((await c.get('/api/session')).body.user.clubs[0].clubName).toBe('Allotment Row Growers');
  });

  it('refuses bad values with each field named, and changes nothing', async () => {
    const { club: row, c } = await club();
    const bad = await c.patch(`/api/clubs/${row.id}`, {
      name: '   ',
      offerDays: 0,
      renewalDays: 91,
      declinedOfferPolicy: 'keep_place',
      currency: 'XYZ',
      allowMultipleOffers: 'yes',
      slug: 'new-slug',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({
      name: 'Enter a name',
      offerDays: 'At least 1 day',
      renewalDays: 'At most 90 days',
      slug: 'Unknown field',
    });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual([
      'allowMultipleOffers',
      'currency',
      'declinedOfferPolicy',
      'name',
      'offerDays',
      'renewalDays',
      'slug',
    ]);
    expect((await c.patch(`/api/clubs/${row.id}`, { offerDays: 61 })).body.error.fields).toEqual({ offerDays: 'At most 60 days' });
    expect((await c.patch(`/api/clubs/${row.id}`, { offerDays: 2.5 })).status).toBe(400);
    // The column's check allows 1 to 10 years (migration 20261202000300).
    expect((await c.patch(`/api/clubs/${row.id}`, { rotationGapYears: 11, sharesPlotBooks: 'yes' })).body.error.fields).toEqual({
      rotationGapYears: 'At most 10 years',
      sharesPlotBooks: 'true or false',
    });
    expect((await c.patch(`/api/clubs/${row.id}`, { rotationGapYears: 0 })).body.error.fields).toEqual({ rotationGapYears: 'At least 1 year' });
    expect(await t.db('clubs').where({ id: row.id }).first('name', 'offer_days', 'slug')).toEqual({ name: 'Allotment Row', offer_days: 7, slug: row.slug });
  });

  it('keeps the settings to coordinators and fixes the currency once fees are recorded', async () => {
    const { club: row, c, holder } = await club();
    const h = await signedIn(holder);
    expect((await h.patch(`/api/clubs/${row.id}`, { offerDays: 3 })).status).toBe(403);

    const [site] = await t.db('sites').insert({ club_id: row.id, name: 'Field', latitude: 51, longitude: 0, time_zone: 'Europe/London' }).returning('id');
    const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
    const [season] = await t.db('seasons').insert({ club_id: row.id, year: 2027 }).returning('id');
    const [alloc] = await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: holder.id, source: 'manual' }).returning('id');
    await t.db('fees').insert({
      club_id: row.id,
      season_id: season.id,
      allocation_id: alloc.id,
      user_id: holder.id,
      plot_id: plot.id,
      description: 'Plot A-1, 2027 season',
      plot_fee_minor: 4500,
      currency: 'GBP',
      due_on: '2027-04-01',
    });
    const refused = await c.patch(`/api/clubs/${row.id}`, { currency: 'USD' });
    expect(refused.status).toBe(409);
    expect(refused.body.error.fields).toEqual({ currency: 'Fees are already recorded in GBP' });
    // Sending the same currency with other changes is fine.
    await c.patch(`/api/clubs/${row.id}`, { currency: 'GBP', offerDays: 5 }).expect(200);
    expect((await t.db('clubs').where({ id: row.id }).first()).currency).toBe('GBP');
    // The settings say the currency is fixed, so the form can disable it.
    expect((await c.get(`/api/clubs/${row.id}`).expect(200)).body.currencyLocked).toBe(true);
  });

  it('keeps a contact address only when it is an e-mail address, and clears notes left empty', async () => {
    const { club: row, c } = await club();
    const bad = await c.patch(`/api/clubs/${row.id}`, { contactEmail: 'not an address', feeNote: 'x'.repeat(201) });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({ contactEmail: 'Enter a valid e-mail address', feeNote: 'At most 200 characters' });
    const ok = await c.patch(`/api/clubs/${row.id}`, { contactEmail: ' Hello@Allotment.example.org ', feeNote: 'From £25 a year', typicalWait: 'About a year' });
    expect(ok.status, JSON.stringify(ok.body)).toBe(200);
    // EmailSchema trims and lower-cases (shared/schemas/common.ts).
    expect(ok.body).toMatchObject({ contactEmail: 'hello@allotment.example.org', feeNote: 'From £25 a year', typicalWait: 'About a year' });
    await c.patch(`/api/clubs/${row.id}`, { contactEmail: null, feeNote: '', typicalWait: '  ' }).expect(200);
    expect(await t.db('clubs').where({ id: row.id }).first('contact_email', 'fee_note', 'typical_wait')).toEqual({ contact_email: null, fee_note: null, typical_wait: null });
  });
});
