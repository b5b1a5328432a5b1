import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { cropBySlug } from '@shared/crops';
import { plusDays } from '@shared/plot-book/dates';
import { buildClub, buildCrop } from '../factories';
import { signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const SOWN = '2026-09-01';

/** A club with a coordinator, one plot and a 2026 season holding a radish sown on SOWN. */
async function clubWithRadish(name: string, radishId: number) {
  const club = await buildClub(t.db, { name });
  const coordinator = await signedInMember(t, club.id, ['coordinator']);
  // No frost dates on the site: the harvest window is the crop's days alone (test inputs, not facts of the trade).
  const [site] = await t.db('sites')
    .insert({ club_id: club.id, name: 'Top field', latitude: 52, longitude: -1, time_zone: 'UTC', width_m: 30, length_m: 20 })
    .returning('id');
  const [plot] = await t.db('plots').insert({ site_id: site.id, label: 'A-1', x_m: 0, y_m: 0, width_m: 3, length_m: 6 }).returning('id');
  const [season] = await t.db('seasons').insert({ club_id: club.id, year: 2026 }).returning('id');
  const [planting] = await t.db('plantings')
    .insert({ plot_id: plot.id, season_id: season.id, crop_id: radishId, method: 'sown', planted_on: SOWN })
    .returning('id');
  return { club, coordinator, plotId: plot.id as number, plantingId: planting.id as number };
}

type Club = Awaited<ReturnType<typeof clubWithRadish>>;

const harvestOf = async (c: Club) => {
  // 2026 is asked for by name so the test does not depend on today's date.
  const res = await c.coordinator.get(`/api/plots/${c.plotId}/book?year=2026`);
  expect(res.status, JSON.stringify(res.body)).toBe(200);
  const planting = res.body.plantings.find((p: { id: number }) => p.id === c.plantingId);
  const one = await c.coordinator.get(`/api/plantings/${c.plantingId}`);
  expect(one.status, JSON.stringify(one.body)).toBe(200);
  // The book and the single planting compute the same window.
  expect(one.body.computed.harvestWindow).toEqual(planting.computed.harvestWindow);
  return { earliest: planting.computed.harvestWindow.earliest, latest: planting.computed.harvestWindow.latest };
};

describe('a club value for days to maturity in the plot book', () => {
  it('moves that club’s harvest window, leaves another club’s alone, and goes back when removed', async () => {
    const radish = await buildCrop(t.db, 'radish');
    const ours = await clubWithRadish('Willow Lane Growers', radish.id);
    const theirs = await clubWithRadish('Far Meadow', radish.id);

    const reference = cropBySlug('radish')!.daysToMaturity.value;
    // The reference counts from sowing, as a sown planting does, so no transplant allowance enters.
    expect(reference.from).toBe('sowing');
    // computed: sown date + the reference's min and max days
    const referenceWindow = { earliest: plusDays(SOWN, reference.min), latest: plusDays(SOWN, reference.max) };
    expect(referenceWindow.earliest).not.toBe('2026-10-01');
    expect(await harvestOf(ours)).toEqual(referenceWindow);

    const override = { value: { min: 30, max: 40, from: 'sowing' }, source: 'Club sowing records 2025' };
    const put = await ours.coordinator.put(`/api/clubs/${ours.club.id}/crops/${radish.id}/overrides/daysToMaturity`, override);
    expect(put.status, JSON.stringify(put.body)).toBe(200);
    expect(await t.db('crop_overrides').where({ club_id: ours.club.id, crop_id: radish.id }).select('field')).toEqual([{ field: 'daysToMaturity' }]);

    // computed: 2026-09-01 + 30 days = 2026-10-01; + 40 days = 2026-10-11
    expect(await harvestOf(ours)).toEqual({ earliest: '2026-10-01', latest: '2026-10-11' });
    expect(await harvestOf(theirs)).toEqual(referenceWindow);

    const del = await ours.coordinator.delete(`/api/clubs/${ours.club.id}/crops/${radish.id}/overrides/daysToMaturity`);
    expect(del.status).toBe(204);
    expect(await harvestOf(ours)).toEqual(referenceWindow);
    expect(await harvestOf(theirs)).toEqual(referenceWindow);
  });

  it('reads every crop’s overrides for a book in one query, whatever the number of plantings', async () => {
    const radish = await buildCrop(t.db, 'radish');
    const ours = await clubWithRadish('Willow Lane Growers', radish.id);
    const season = await t.db('seasons').where({ club_id: ours.club.id, year: 2026 }).first('id');
    await t.db('plantings').insert(
      ['2026-09-02', '2026-09-03', '2026-09-04'].map((d) => ({ plot_id: ours.plotId, season_id: season.id, crop_id: radish.id, method: 'sown', planted_on: d })),
    );
    await ours.coordinator
      .put(`/api/clubs/${ours.club.id}/crops/${radish.id}/overrides/daysToMaturity`, { value: { min: 30, max: 40, from: 'sowing' }, source: 'common-practice' })
      .expect(200);

    const queries: string[] = [];
    const onQuery = (q: { sql: string }) => {
      if (/crop_overrides/.test(q.sql)) queries.push(q.sql);
    };
    t.db.on('query', onQuery);
    try {
      const res = await ours.coordinator.get(`/api/plots/${ours.plotId}/book?year=2026`).expect(200);
      // computed: each sowing date + 30 days
      expect(res.body.plantings.map((p: { computed: { harvestWindow: { earliest: string } } }) => p.computed.harvestWindow.earliest)).toEqual([
        '2026-10-01', '2026-10-02', '2026-10-03', '2026-10-04',
      ]);
    } finally {
      t.db.off('query', onQuery);
    }
    expect(queries).toHaveLength(1);
  });
});
