import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import Papa from 'papaparse';
import { feetToMetres } from '@shared/geometry';
import type { FeeSchedule } from '@shared/schemas/fees';
import { createFeeForAllocation } from '../../server/services/fee-charges';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, mailUrl, setupTestApp, truncateAll } from '../helpers/app';
import { waitForMail } from '../helpers/inbox';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const schedule: FeeSchedule = {
  basis: 'area',
  areaUnit: 'm2',
  rateMinorPerArea: 250,
  priceInGroundMinor: 4000,
  priceRaisedBedMinor: 2500,
  priceContainerMinor: 800,
  priceSharedBedMinor: 0,
  concessionPercent: 50,
  depositMinor: 1500,
};

type Club = Awaited<ReturnType<typeof buildClub>>;

/** A site on the club, made straight in the database since sites have their own tests. */
async function buildSite(clubId: number, name = 'North field') {
  const [site] = await t.db('sites')
    .insert({ club_id: clubId, name, latitude: 51.5, longitude: -0.12, time_zone: 'Europe/London', width_m: 60, length_m: 40 })
    .returning('id');
  return site.id as number;
}

async function buildPlot(siteId: number, p: { label: string; x?: number; width?: number; length?: number; kind?: string }) {
  const [plot] = await t.db('plots')
    .insert({ site_id: siteId, label: p.label, x_m: p.x ?? 0, y_m: 0, width_m: p.width ?? 3, length_m: p.length ?? 6, kind: p.kind ?? 'in_ground' })
    .returning('id');
  return plot.id as number;
}

async function seasonOf(clubId: number, year: number) {
  const found = await t.db('seasons').where({ club_id: clubId, year }).first('id');
  if (found) return found.id as number;
  const [season] = await t.db('seasons').insert({ club_id: clubId, year }).returning('id');
  return season.id as number;
}

/** Allocates a plot to a person for a season and creates its fee the way accepting an offer does. */
async function allocateWithFee(opts: { clubId: number; plotId: number; userId: number; year?: number; now?: Date }) {
  const seasonId = await seasonOf(opts.clubId, opts.year ?? 2027);
  return t.db.transaction(async (trx) => {
    const [a] = await trx('allocations')
      .insert({ season_id: seasonId, plot_id: opts.plotId, user_id: opts.userId, source: 'offer' })
      .returning('id');
    return createFeeForAllocation(trx, { allocationId: a.id, now: opts.now });
  });
}

async function signedIn(person: { email: string; password: string | null }) {
  const c = await browserLikeAgent(t.app);
  await c.signIn(person.email, person.password!).then((r) => expect(r.status).toBe(200));
  return c;
}

/** A club with a coordinator, a plot holder, a 3 × 6 m plot and the schedule above; `now` dates the fee. */
async function clubWithFee(overrides: Partial<FeeSchedule> = {}, opts: { now?: Date } = {}) {
  const club: Club = await buildClub(t.db);
  const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'], user: { name: 'Maren Coordinator' } });
  const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { name: 'Teodor Holder' } });
  const c = await signedIn(coord);
  await c.put(`/api/clubs/${club.id}/fee-schedule`, { ...schedule, ...overrides }).expect(200);
  const siteId = await buildSite(club.id);
  const plotId = await buildPlot(siteId, { label: 'A-1' });
  const feeId = await allocateWithFee({ clubId: club.id, plotId, userId: holder.id, now: opts.now });
  return { club, coord, holder, c, siteId, plotId, feeId };
}

const pay = (amountMinor: number, extra: object = {}) => ({ amountMinor, method: 'cash', paidOn: '2027-03-14', ...extra });

describe('fee schedule', () => {
  it('starts at zero, saves with PUT, reads back the same and updates in place', async () => {
    const club = await buildClub(t.db);
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await signedIn(coord);
    const empty = await c.get(`/api/clubs/${club.id}/fee-schedule`).expect(200);
    expect(empty.body).toMatchObject({ basis: 'kind', rateMinorPerArea: 0, depositMinor: 0 });

    const saved = await c.put(`/api/clubs/${club.id}/fee-schedule`, schedule).expect(200);
    expect(saved.body).toEqual(schedule);
    expect((await c.get(`/api/clubs/${club.id}/fee-schedule`).expect(200)).body).toEqual(schedule);

    const changed = { ...schedule, basis: 'kind', depositMinor: 2000 };
    await c.put(`/api/clubs/${club.id}/fee-schedule`, changed).expect(200);
    expect((await c.get(`/api/clubs/${club.id}/fee-schedule`)).body).toEqual(changed);
    expect(await t.db('fee_schedules').where({ club_id: club.id }).count()).toEqual([{ count: 1 }]);
  });

  it('refuses bad values with each field named and saves nothing', async () => {
    const club = await buildClub(t.db);
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    const c = await signedIn(coord);
    const bad = await c.put(`/api/clubs/${club.id}/fee-schedule`, {
      ...schedule,
      basis: 'per_plot',
      rateMinorPerArea: 2.5,
      concessionPercent: 120,
      depositMinor: -1,
      colour: 'green',
    });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toMatchObject({
      rateMinorPerArea: 'Whole minor units (pence, cents)',
      concessionPercent: '0 to 100',
      depositMinor: 'Cannot be negative',
      colour: 'Unknown field',
    });
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['basis', 'colour', 'concessionPercent', 'depositMinor', 'rateMinorPerArea']);
    const missing = await c.put(`/api/clubs/${club.id}/fee-schedule`, { basis: 'area' });
    expect(missing.status).toBe(400);
    expect(missing.body.error.fields).toHaveProperty('depositMinor');
    expect(await t.db('fee_schedules').count()).toEqual([{ count: 0 }]);
  });
});

describe('fee amounts', () => {
  it('charges an area-based fee in minor units: 3 × 6 m at 2.50 a m² is 4500, concession half of it', async () => {
    const { club, holder, feeId, siteId, c } = await clubWithFee();
    // 18 m² × 250 = 4500 (computed); the deposit is never discounted.
    expect(await t.db('fees').where({ id: feeId }).first('plot_fee_minor', 'deposit_minor', 'currency', 'is_concession')).toEqual({
      plot_fee_minor: 4500,
      deposit_minor: 1500,
      currency: 'GBP',
      is_concession: false,
    });
    const other = await buildPlot(siteId, { label: 'A-2', x: 4 });
    // The coordinator gives the holder the concession: new fees use the concession rate.
    await c.patch(`/api/clubs/${club.id}/members/${holder.id}`, { concession: true }).expect(200);
    const concessionFee = await allocateWithFee({ clubId: club.id, plotId: other, userId: holder.id });
    // 4500 × 50 % = 2250 (computed).
    expect((await t.db('fees').where({ id: concessionFee }).first()).plot_fee_minor).toBe(2250);
  });

  it('charges per square foot on the exact conversion: 10 × 20 ft at 30 cents a ft² is 6000', async () => {
    const { club, holder, siteId, c } = await clubWithFee();
    await c.put(`/api/clubs/${club.id}/fee-schedule`, { ...schedule, areaUnit: 'ft2', rateMinorPerArea: 30 }).expect(200);
    // NIST SP 811 Appendix B: 1 ft = 0.3048 m exactly; 200 ft² × 30 = 6000 (computed).
    const plot = await buildPlot(siteId, { label: 'N-1', x: 10, width: feetToMetres(10), length: feetToMetres(20) });
    const feeId = await allocateWithFee({ clubId: club.id, plotId: plot, userId: holder.id });
    expect((await t.db('fees').where({ id: feeId }).first()).plot_fee_minor).toBe(6000);
  });

  it('charges a kind-based fee from the price of the kind of plot', async () => {
    const { club, holder, siteId, c } = await clubWithFee({ basis: 'kind' });
    const bed = await buildPlot(siteId, { label: 'R-1', x: 10, width: 1.2, length: 2.4, kind: 'raised_bed' });
    const pot = await buildPlot(siteId, { label: 'K-1', x: 15, width: 1, length: 1, kind: 'container' });
    const bedFee = await allocateWithFee({ clubId: club.id, plotId: bed, userId: holder.id });
    expect((await t.db('fees').where({ id: bedFee }).first()).plot_fee_minor).toBe(2500);
    await c.patch(`/api/clubs/${club.id}/members/${holder.id}`, { concession: true }).expect(200);
    const potFee = await allocateWithFee({ clubId: club.id, plotId: pot, userId: holder.id });
    // 800 × 50 % = 400 (computed).
    expect((await t.db('fees').where({ id: potFee }).first()).plot_fee_minor).toBe(400);
    // The bed's fee had nothing paid, so the concession re-priced it: 2500 × 50 % = 1250 (computed).
    expect(await t.db('fees').where({ id: bedFee }).first('plot_fee_minor', 'is_concession')).toEqual({ plot_fee_minor: 1250, is_concession: true });
  });
});

describe('payments', () => {
  it('takes partial payments, then the rest, down to a balance of 0; more than is owed is refused', async () => {
    const { c, feeId } = await clubWithFee();
    const first = await c.post(`/api/fees/${feeId}/payments`, pay(2000, { note: 'First half' }));
    expect(first.status).toBe(201);
    // 4500 + 1500 − 2000 = 4000 (computed); the plot fee is covered first, so no deposit is held yet.
    expect(first.body).toMatchObject({ id: feeId, paidMinor: 2000, balanceMinor: 4000, depositHeldMinor: 0 });
    expect(first.body.payments).toEqual([
      expect.objectContaining({ kind: 'payment', amountMinor: 2000, method: 'cash', paidOn: '2027-03-14', note: 'First half', recordedBy: 'Maren Coordinator' }),
    ]);

    const tooMuch = await c.post(`/api/fees/${feeId}/payments`, pay(4001));
    expect(tooMuch.status).toBe(400);
    expect(tooMuch.body.error.fields).toEqual({ amountMinor: 'At most £40.00, what is still owed' });

    const rest = await c.post(`/api/fees/${feeId}/payments`, pay(4000, { method: 'bank_transfer', paidOn: '2027-03-20' })).expect(201);
    expect(rest.body).toMatchObject({ paidMinor: 6000, balanceMinor: 0, depositHeldMinor: 1500 });
    expect(rest.body.payments).toHaveLength(2);
    const again = await c.post(`/api/fees/${feeId}/payments`, pay(1));
    expect(again.body.error.fields).toEqual({ amountMinor: 'This fee is fully paid' });
  });

  it('refunds the deposit held and refuses a refund larger than the deposit', async () => {
    const { c, feeId } = await clubWithFee();
    const none = await c.post(`/api/fees/${feeId}/payments`, pay(100, { kind: 'refund' }));
    expect(none.status).toBe(400);
    expect(none.body.error.fields).toEqual({ amountMinor: 'No deposit is held for this fee' });

    await c.post(`/api/fees/${feeId}/payments`, pay(6000)).expect(201);
    const tooBig = await c.post(`/api/fees/${feeId}/payments`, pay(1501, { kind: 'refund' }));
    expect(tooBig.status).toBe(400);
    expect(tooBig.body.error.fields).toEqual({ amountMinor: 'At most £15.00, the deposit held' });

    const part = await c.post(`/api/fees/${feeId}/payments`, pay(500, { kind: 'refund', method: 'bank_transfer' })).expect(201);
    expect(part.body).toMatchObject({ refundedMinor: 500, depositHeldMinor: 1000, balanceMinor: 0 });
    const rest = await c.post(`/api/fees/${feeId}/payments`, pay(1000, { kind: 'refund', method: 'bank_transfer' })).expect(201);
    // Handing the deposit back leaves the fee settled (feeBalance): nothing held, nothing owed.
    expect(rest.body).toMatchObject({ paidMinor: 6000, refundedMinor: 1500, depositHeldMinor: 0, balanceMinor: 0 });
    expect((await c.post(`/api/fees/${feeId}/payments`, pay(1, { kind: 'refund' }))).status).toBe(400);
    expect(await t.db('payments').where({ fee_id: feeId }).count()).toEqual([{ count: 3 }]);
  });

  it('counts two payments posted at the same moment, and lets no parallel pair pay more than is owed', async () => {
    const { c, feeId } = await clubWithFee();
    const both = await Promise.all([c.post(`/api/fees/${feeId}/payments`, pay(1000)), c.post(`/api/fees/${feeId}/payments`, pay(2000))]);
    expect(both.map((r) => r.status)).toEqual([201, 201]);
    const after = (await c.get(`/api/clubs/${(await t.db('fees').where({ id: feeId }).first()).club_id}/fees`)).body.items[0];
    expect(after).toMatchObject({ paidMinor: 3000, balanceMinor: 3000 });
    expect(after.payments).toHaveLength(2);

    // 3000 is left; each of these fits alone, together they would not.
    const race = await Promise.all([c.post(`/api/fees/${feeId}/payments`, pay(2000)), c.post(`/api/fees/${feeId}/payments`, pay(2000))]);
    expect(race.map((r) => r.status).sort()).toEqual([201, 400]);
    expect(await t.db('payments').where({ fee_id: feeId }).sum({ s: 'amount_minor' })).toEqual([{ s: 5000 }]);
  });

  it('e-mails the holder a receipt with the amount, method, date and what is still owed', async () => {
    const { c, feeId, holder, club } = await clubWithFee();
    const since = Date.now();
    await c.post(`/api/fees/${feeId}/payments`, pay(2000, { method: 'bank_transfer' })).expect(201);
    const mail = await waitForMail(mailUrl(), { to: holder.email, after: since });
    expect(mail.subject).toBe(`Receipt: £20.00 paid to ${club.name}`);
    expect(mail.text).toContain(`${club.name} has received £20.00 from you for Plot A-1, 2027 season, by bank transfer on 14 Mar 2027.`);
    expect(mail.text).toContain('Still to pay: £40.00.');
    expect(mail.text).toContain(`You got this because a coordinator of ${club.name} recorded a payment`);
    expect(mail.html).toContain('£20.00');

    await c.post(`/api/fees/${feeId}/payments`, pay(4000)).expect(201);
    const refundAt = Date.now();
    await c.post(`/api/fees/${feeId}/payments`, pay(1500, { kind: 'refund', paidOn: '2027-10-31' })).expect(201);
    const refund = await waitForMail(mailUrl(), { to: holder.email, subject: 'Deposit refunded', after: refundAt });
    expect(refund.subject).toBe(`Deposit refunded: £15.00 (${club.name})`);
    expect(refund.text).toContain('by cash on 31 Oct 2027');
    expect(refund.text).toContain('Nothing more is owed for this plot.');
  });

  it('refuses a bad payment body with the fields named', async () => {
    const { c, feeId } = await clubWithFee();
    const bad = await c.post(`/api/fees/${feeId}/payments`, { kind: 'gift', amountMinor: 12.5, method: 'barter', paidOn: '14/03/2027', extra: 1 });
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['amountMinor', 'extra', 'kind', 'method', 'paidOn']);
    expect((await c.post(`/api/fees/${feeId}/payments`, pay(0))).body.error.fields).toEqual({ amountMinor: 'Must be more than 0' });
  });
});

describe('fee lists and export', () => {
  async function threeFees() {
    // Teodor's fee is charged on 2026-12-15, so it is due 30 days later (computed: 16 days to
    // 31 December, 14 into January: 2027-01-14).
    const ctx = await clubWithFee({}, { now: new Date('2026-12-15T12:00:00Z') });
    const { club, siteId, c } = ctx;
    const priya = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { name: 'Priya Raman' } });
    const jonah = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'], user: { name: '=Jonah' } });
    const b1 = await buildPlot(siteId, { label: 'B-1', x: 4 });
    const b2 = await buildPlot(siteId, { label: 'B-2', x: 8 });
    // Priya's fee is due on 2027-01-31 (charged 2027-01-01, + 30 days), Jonah's last season.
    const priyaFee = await allocateWithFee({ clubId: club.id, plotId: b1, userId: priya.id, now: new Date('2027-01-01T12:00:00Z') });
    const oldFee = await allocateWithFee({ clubId: club.id, plotId: b2, userId: jonah.id, year: 2026, now: new Date('2026-02-01T12:00:00Z') });
    await c.post(`/api/fees/${priyaFee}/payments`, pay(6000)).expect(201);
    await c.post(`/api/fees/${ctx.feeId}/payments`, pay(1234)).expect(201);
    return { ...ctx, priya, priyaFee, oldFee };
  }

  it('lists unpaid fees first, then by due date, filters by season and status, and totals in minor units', async () => {
    const { c, club, feeId, priyaFee, oldFee } = await threeFees();
    const all = (await c.get(`/api/clubs/${club.id}/fees`).expect(200)).body;
    expect(all.items.map((f: { id: number }) => f.id)).toEqual([oldFee, feeId, priyaFee]);
    expect(all.total).toBe(3);
    // 3 × 6000 due, 6000 + 1234 paid, 6000 − 1234 + 6000 outstanding (computed).
    expect(all.totals).toEqual({ dueMinor: 18000, paidMinor: 7234, refundedMinor: 0, outstandingMinor: 10766 });
    expect(all.items[0]).toMatchObject({ seasonYear: 2026, holderName: '=Jonah', plotLabel: 'B-2', siteName: 'North field', dueOn: '2026-03-03' });

    const season = (await c.get(`/api/clubs/${club.id}/fees?year=2027`).expect(200)).body;
    expect(season.items.map((f: { id: number }) => f.id)).toEqual([feeId, priyaFee]);
    const unpaid = (await c.get(`/api/clubs/${club.id}/fees?year=2027&status=unpaid`).expect(200)).body;
    expect(unpaid.items.map((f: { id: number }) => f.id)).toEqual([feeId]);
    expect(unpaid.totals).toEqual({ dueMinor: 6000, paidMinor: 1234, refundedMinor: 0, outstandingMinor: 4766 });
    const paid = (await c.get(`/api/clubs/${club.id}/fees?status=paid`).expect(200)).body;
    expect(paid.items.map((f: { id: number }) => f.id)).toEqual([priyaFee]);
    const bad = await c.get(`/api/clubs/${club.id}/fees?year=27&status=late`);
    expect(bad.status).toBe(400);
    expect(Object.keys(bad.body.error.fields).sort()).toEqual(['status', 'year']);
  });

  it('exports the season as CSV with decimal amounts, a currency column and formula-safe text', async () => {
    const { c, club, holder, priya } = await threeFees();
    const res = await c.get(`/api/clubs/${club.id}/fees.csv?year=2027`).expect(200);
    expect(res.headers['content-type']).toBe('text/csv; charset=utf-8');
    expect(res.headers['content-disposition']).toBe(`attachment; filename=${club.slug}-fees-2027.csv`);
    const parsed = Papa.parse<string[]>(res.text.replace(/^\uFEFF/, ''), { skipEmptyLines: true });
    expect(parsed.data).toEqual([
      ['season', 'holder', 'email', 'site', 'plot', 'description', 'currency', 'plot_fee', 'deposit', 'concession', 'due_on', 'paid', 'refunded', 'deposit_held', 'balance'],
      ['2027', 'Teodor Holder', holder.email, 'North field', 'A-1', 'Plot A-1, 2027 season', 'GBP', '45.00', '15.00', 'no', '2027-01-14', '12.34', '0.00', '0.00', '47.66'],
      ['2027', 'Priya Raman', priya.email, 'North field', 'B-1', 'Plot B-1, 2027 season', 'GBP', '45.00', '15.00', 'no', '2027-01-31', '60.00', '0.00', '15.00', '0.00'],
    ]);
    const everything = Papa.parse<string[]>((await c.get(`/api/clubs/${club.id}/fees.csv`).expect(200)).text, { skipEmptyLines: true });
    expect(everything.data).toHaveLength(4);
    // A name that starts like a formula is written so a spreadsheet shows it as text (OWASP, "CSV Injection").
    expect(everything.data[1][1]).toBe("'=Jonah");
  });
});

describe('who may see and record fees', () => {
  it('gives a plot holder 403 on the coordinator endpoints and their own fees on /api/me/fees', async () => {
    const { club, holder, feeId, siteId } = await clubWithFee();
    const other = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    await allocateWithFee({ clubId: club.id, plotId: await buildPlot(siteId, { label: 'Z-9', x: 20 }), userId: other.id });
    const h = await signedIn(holder);
    for (const res of [
      await h.get(`/api/clubs/${club.id}/fee-schedule`),
      await h.put(`/api/clubs/${club.id}/fee-schedule`, schedule),
      await h.get(`/api/clubs/${club.id}/fees`),
      await h.get(`/api/clubs/${club.id}/fees.csv`),
      await h.post(`/api/fees/${feeId}/payments`, pay(100)),
    ]) {
      expect(res.status).toBe(403);
    }
    const mine = await h.get('/api/me/fees').expect(200);
    expect(mine.body.total).toBe(1);
    expect(mine.body.items[0]).toMatchObject({ id: feeId, clubId: club.id, clubName: club.name, plotLabel: 'A-1', balanceMinor: 6000, currency: 'GBP' });
    const anon = await browserLikeAgent(t.app);
    expect((await anon.get('/api/me/fees')).status).toBe(401);
  });

  it("answers 404 to another club's coordinator recording a payment, and to a fee that does not exist", async () => {
    const { feeId } = await clubWithFee();
    const elsewhere = await buildMember(t.db, { roles: ['coordinator'] });
    const o = await signedIn(elsewhere);
    const res = await o.post(`/api/fees/${feeId}/payments`, pay(100));
    expect(res.status).toBe(404);
    expect(res.body.error.message).toBe('The fee was not found.');
    expect((await o.post('/api/fees/999999/payments', pay(100))).status).toBe(404);
    expect(await t.db('payments').count()).toEqual([{ count: 0 }]);
    expect((await o.get(`/api/clubs/${(await t.db('fees').first()).club_id}/fees`)).status).toBe(403);
  });
});
