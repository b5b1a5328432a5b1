import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { SeasonSummarySchema } from '@shared/schemas/season-summary';
import { mondayOf } from '../../server/services/season-summary';
import { buildApplication, buildClub, buildCrop, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

// A new club's zone is UTC (the clubs table's default), so "this season" is the current UTC year and
// the shift weeks start on this UTC week's Monday.
const YEAR = Number(localToday('UTC').slice(0, 4));
const TODAY = localToday('UTC');
const MONDAY = mondayOf(TODAY);
const inDays = (days: number) => new Date(Date.now() + days * 86_400_000);
let tokens = 0;
const token = () => `${Date.now().toString(16)}${(tokens++).toString(16)}`.padEnd(64, '0');

/**
 * Two live sites and an archived one, last season and this one (the newest), with:
 * North: N-1 and N-2 held, N-3 offered, N-4 free, N-5 deleted; South: S-1 held, S-2 waiting for a
 * renewal; Old yard (archived): Z-1 held. Fees, shifts, findings and harvests as each test says.
 */
async function fixture() {
  const c = await buildClub(t.db, { name: 'Hazel Row Growers' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const holder = await signedInMember(t, c.id, ['plot_holder']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const other = await buildClub(t.db, { name: 'Elm Corner' });
  const otherCoordinator = await signedInMember(t, other.id, ['coordinator']);
  const h2 = await buildMember(t.db, { clubId: c.id });
  const h3 = await buildMember(t.db, { clubId: c.id });
  const site = { club_id: c.id, latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20 };
  const [north] = await t.db('sites').insert({ ...site, name: 'North' }).returning('id');
  const [south] = await t.db('sites').insert({ ...site, name: 'South' }).returning('id');
  const [old] = await t.db('sites').insert({ ...site, name: 'Old yard', archived_at: new Date() }).returning('id');
  const plot = (siteId: number, label: string, x: number, more: Record<string, unknown> = {}) => ({ site_id: siteId, label, x_m: x, y_m: 0, width_m: 3, length_m: 5, ...more });
  const rows = await t.db('plots')
    .insert([
      plot(north.id, 'N-1', 0),
      plot(north.id, 'N-2', 4),
      plot(north.id, 'N-3', 8),
      plot(north.id, 'N-4', 12),
      plot(north.id, 'N-5', 16, { deleted_at: new Date() }),
      plot(south.id, 'S-1', 0),
      plot(south.id, 'S-2', 4),
      plot(old.id, 'Z-1', 0),
    ])
    .returning(['id', 'label']);
  const p = Object.fromEntries(rows.map((r: { id: number; label: string }) => [r.label, r.id])) as Record<string, number>;
  const [last] = await t.db('seasons').insert({ club_id: c.id, year: YEAR - 1 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: YEAR }).returning('id');
  const alloc = async (seasonId: number, plotId: number, userId: number) =>
    (await t.db('allocations').insert({ season_id: seasonId, plot_id: plotId, user_id: userId, source: 'manual' }).returning('id'))[0].id as number;
  const a1 = await alloc(season.id, p['N-1'], holder.person.id);
  const a2 = await alloc(season.id, p['N-2'], h2.id);
  await alloc(season.id, p['S-1'], h3.id);
  await alloc(season.id, p['Z-1'], h3.id);
  // Last season's N-4 was held, but that is history: this season it is free.
  await alloc(last.id, p['N-4'], h2.id);
  const lastS2 = await alloc(last.id, p['S-2'], h3.id);
  const app = await buildApplication(t.db, { clubId: c.id, status: 'offered' });
  await t.db('offers').insert({ season_id: season.id, plot_id: p['N-3'], application_id: app.id, token_hash: token(), deadline: inDays(7) });
  await t.db('renewals').insert({ season_id: season.id, previous_allocation_id: lastS2, plot_id: p['S-2'], user_id: h3.id, token_hash: token(), deadline: inDays(7) });
  return { c, coordinator, holder, volunteer, otherCoordinator, north: north.id as number, south: south.id as number, p, season: season.id as number, last: last.id as number, a1, a2, h2 };
}

describe('GET /api/clubs/:clubId/season-summary', () => {
  it('is for the club coordinator only: 401 signed out, 403 for a holder, a volunteer and another club’s coordinator', async () => {
    const s = await fixture();
    const url = `/api/clubs/${s.c.id}/season-summary`;
    expect((await (await browserLikeAgent(t.app)).get(url)).status).toBe(401);
    // DEVELOPERS.md: "Someone who is not a member of a club gets 403 on that club's routes"; a member
    // without the role gets the same 403 (requireClubRole).
    for (const [who, agent] of [['holder', s.holder], ['volunteer', s.volunteer], ['other club’s coordinator', s.otherCoordinator]] as const) {
      const res = await agent.get(url);
      expect(res.status, who).toBe(403);
      expect(res.body.error.code, who).toBe('forbidden');
    }
    expect((await s.coordinator.get(url)).status).toBe(200);
  });

  it('counts plots by state per live site in the newest season', async () => {
    const s = await fixture();
    const res = await s.coordinator.get(`/api/clubs/${s.c.id}/season-summary`);
    expect(res.status).toBe(200);
    const body = SeasonSummarySchema.parse(res.body);
    expect(body.season).toEqual({ id: s.season, year: YEAR });
    // Sites by name; the archived Old yard is left out.
    expect(body.sites).toEqual([
      // computed: N-1, N-2 held → taken 2; N-3 offered 1; N-4 free 1 (held last season only); N-5 deleted, not counted
      { siteId: s.north, name: 'North', free: 1, offered: 1, renewalPending: 0, taken: 2 },
      // computed: S-1 held → taken 1; S-2 renewal pending 1; nothing free
      { siteId: s.south, name: 'South', free: 0, offered: 0, renewalPending: 1, taken: 1 },
    ]);
  });

  it('adds up this season’s fees as the fees page does, in the club’s currency', async () => {
    const s = await fixture();
    const fee = async (allocationId: number, userId: number, plotId: number, seasonId: number, plotFee: number, deposit: number) =>
      (
        await t.db('fees')
          .insert({ club_id: s.c.id, season_id: seasonId, allocation_id: allocationId, user_id: userId, plot_id: plotId, description: 'Plot fee', plot_fee_minor: plotFee, deposit_minor: deposit, currency: 'GBP', due_on: `${YEAR}-04-01` })
          .returning('id')
      )[0].id as number;
    const f1 = await fee(s.a1, s.holder.person.id, s.p['N-1'], s.season, 2500, 1000);
    const f2 = await fee(s.a2, s.h2.id, s.p['N-2'], s.season, 3000, 0);
    // Last season's fee is not this season's.
    const lastAlloc = (await t.db('allocations').where({ season_id: s.last, plot_id: s.p['N-4'] }).first('id')).id;
    const f0 = await fee(lastAlloc, s.h2.id, s.p['N-4'], s.last, 9900, 0);
    const pay = (feeId: number, amount: number, kind = 'payment') => ({ fee_id: feeId, kind, amount_minor: amount, method: 'cash', paid_on: `${YEAR}-04-02` });
    await t.db('payments').insert([pay(f1, 3500), pay(f2, 1000), pay(f1, 400, 'refund'), pay(f0, 9900)]);

    const body = SeasonSummarySchema.parse((await s.coordinator.get(`/api/clubs/${s.c.id}/season-summary`)).body);
    // computed: due (2500 + 1000) + 3000 = 6500; paid 3500 + 1000 = 4500; refunded 400; two fees; f0 is last season's
    expect(body.fees).toEqual({ currency: 'GBP', dueMinor: 6500, paidMinor: 4500, refundedMinor: 400, count: 2 });
    // The same numbers as the fees page's totals for the year.
    const page = await s.coordinator.get(`/api/clubs/${s.c.id}/fees?year=${YEAR}`);
    expect(page.body.totals).toMatchObject({ dueMinor: body.fees.dueMinor, paidMinor: body.fees.paidMinor, refundedMinor: body.fees.refundedMinor });
  });

  it('counts shift places taken against places for this week and the three after it', async () => {
    const s = await fixture();
    const shift = async (onDate: string, capacity: number, more: Record<string, unknown> = {}) =>
      (
        await t.db('shifts')
          .insert({
            club_id: s.c.id,
            site_id: s.north,
            title: 'Watering',
            kind: 'water',
            on_date: onDate,
            start_time: '09:00',
            end_time: '11:00',
            starts_at: new Date(`${onDate}T09:00:00Z`),
            ends_at: new Date(`${onDate}T11:00:00Z`),
            capacity,
            est_hours: 2,
            ...more,
          })
          .returning('id')
      )[0].id as number;
    const people = await Promise.all([1, 2, 3].map(() => buildMember(t.db, { clubId: s.c.id, roles: ['volunteer'] })));
    const claim = (shiftId: number, userIndex: number, status: string) => ({ shift_id: shiftId, user_id: people[userIndex].id, status, via: 'board' });
    const thisWeek = await shift(MONDAY, 3);
    const calledOff = await shift(addCalendarDays(MONDAY, 2), 2, { called_off_at: new Date() });
    const weekThree = await shift(addCalendarDays(MONDAY, 15), 1);
    const weekFive = await shift(addCalendarDays(MONDAY, 28), 5);
    await shift(addCalendarDays(MONDAY, -1), 4);
    await t.db('shift_claims').insert([
      claim(thisWeek, 0, 'taken'),
      claim(thisWeek, 1, 'done'),
      claim(thisWeek, 2, 'released'),
      claim(calledOff, 0, 'taken'),
      claim(weekThree, 0, 'taken'),
      claim(weekThree, 1, 'taken'),
      claim(weekFive, 0, 'taken'),
    ]);
    const body = SeasonSummarySchema.parse((await s.coordinator.get(`/api/clubs/${s.c.id}/season-summary`)).body);
    expect(body.shiftWeeks).toEqual([
      // computed: this week's one shift (the called-off one left out): 3 places, taken + done = 2 (released does not count)
      { weekStart: MONDAY, shifts: 1, places: 3, taken: 2 },
      { weekStart: addCalendarDays(MONDAY, 7), shifts: 0, places: 0, taken: 0 },
      // computed: Monday + 15 days is in the third week; 2 claims on 1 place count as 1 (at most the places)
      { weekStart: addCalendarDays(MONDAY, 14), shifts: 1, places: 1, taken: 1 },
      // computed: Monday + 28 is the fifth week and the Sunday before Monday is last week: neither counts
      { weekStart: addCalendarDays(MONDAY, 21), shifts: 0, places: 0, taken: 0 },
    ]);
  });

  it('counts this season’s findings by kind and its harvest so far', async () => {
    const s = await fixture();
    const crop = await buildCrop(t.db, 'potato');
    const planting = async (plotId: number, seasonId: number, status: string) =>
      (await t.db('plantings').insert({ plot_id: plotId, season_id: seasonId, crop_id: crop.id, method: 'transplanted', planted_on: `${YEAR}-04-01`, status }).returning('id'))[0].id as number;
    const grown = await planting(s.p['N-1'], s.season, 'up');
    const planned = await planting(s.p['N-2'], s.season, 'planned');
    const lastYear = await planting(s.p['N-1'], s.last, 'finished');
    const finding = (plantingId: number, plotId: number, seasonId: number, kind: string, key: string, severity = 'watch') => ({
      club_id: s.c.id,
      site_id: s.north,
      season_id: seasonId,
      plot_id: plotId,
      planting_id: plantingId,
      key,
      severity,
      kind,
      rule: 'test',
      title: 'A finding',
      message: 'Made for the test.',
      peers: '[]',
      source: '{}',
      numbers: '{}',
    });
    await t.db('findings').insert([
      finding(grown, s.p['N-1'], s.season, 'rotation', 'r1', 'clash'),
      finding(grown, s.p['N-1'], s.season, 'rotation', 'r2'),
      finding(planned, s.p['N-2'], s.season, 'companion', 'c1', 'good'),
      finding(lastYear, s.p['N-1'], s.last, 'shade', 's1'),
    ]);
    await t.db('harvests').insert([
      { planting_id: grown, harvested_on: `${YEAR}-07-01`, grams: 1200 },
      { planting_id: grown, harvested_on: `${YEAR}-07-08`, grams: 300, count: 4 },
      { planting_id: planned, harvested_on: `${YEAR}-07-08`, grams: 50 },
      { planting_id: lastYear, harvested_on: `${YEAR - 1}-07-08`, grams: 9000 },
    ]);
    const body = SeasonSummarySchema.parse((await s.coordinator.get(`/api/clubs/${s.c.id}/season-summary`)).body);
    expect(body.findingsSeasonYear).toBe(YEAR);
    // computed: this season rotation r1 + r2 = 2, companion c1 = 1; last season's shade finding not counted
    expect(body.findings).toEqual([
      { kind: 'rotation', count: 2 },
      { kind: 'companion', count: 1 },
      { kind: 'shade', count: 0 },
      { kind: 'site_fit', count: 0 },
    ]);
    // computed: grown planting 1200 + 300 = 1500 g, 4 counted; the planned one is not grown (harvest-figures' rule); last year's 9000 g is another season; units: the sites default to metric
    expect(body.harvest).toEqual({ seasonYear: YEAR, grams: 1500, count: 4, plantings: 1, units: 'metric' });
  });
});
