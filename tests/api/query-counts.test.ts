import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { addCalendarDays, localToday } from '@shared/dates';
import { buildClub, buildMember } from '../factories';
import { signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

// The map's reads and the shift board make the same number of SQL queries however many plots or
// shifts there are: no query per row. Counted through knex's query events on the app's own pool.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

async function countQueries(fn: () => Promise<{ status: number }>): Promise<number> {
  let n = 0;
  const listener = () => n++;
  t.db.on('query', listener);
  try {
    const res = await fn();
    expect(res.status, JSON.stringify((res as { body?: unknown }).body)).toBe(200);
  } finally {
    t.db.off('query', listener);
  }
  return n;
}

/** A club with a site of `plots` plots in rows, each held this season, and `shifts` shifts with a place taken on each. */
async function clubWith(plots: number, shifts: number) {
  const c = await buildClub(t.db);
  await t.db('clubs').where({ id: c.id }).update({ time_zone: 'UTC' });
  const coordinator = await signedInMember(t, c.id, ['coordinator']);
  const volunteer = await signedInMember(t, c.id, ['volunteer']);
  const [site] = await t.db('sites').insert({ club_id: c.id, name: 'Field', latitude: 51, longitude: 0, time_zone: 'UTC', width_m: 200, length_m: 200 }).returning('id');
  const rows = await t.db('plots')
    .insert(Array.from({ length: plots }, (_, i) => ({ site_id: site.id, label: `P-${i + 1}`, x_m: (i % 20) * 4, y_m: Math.floor(i / 20) * 7, width_m: 3, length_m: 6 })))
    .returning('id');
  const [season] = await t.db('seasons').insert({ club_id: c.id, year: Number(localToday('UTC').slice(0, 4)) }).returning('id');
  const holders = await Promise.all(rows.map(() => buildMember(t.db, { clubId: c.id, roles: ['plot_holder'] })));
  await t.db('allocations').insert(rows.map((p: { id: number }, i: number) => ({ season_id: season.id, plot_id: p.id, user_id: holders[i].id, source: 'manual' })));
  const day = addCalendarDays(localToday('UTC'), 2);
  for (let i = 0; i < shifts; i++) {
    const [sh] = await t.db('shifts')
      .insert({ club_id: c.id, site_id: site.id, title: `Shift ${i}`, kind: 'water', on_date: day, start_time: '18:00', end_time: '19:00', starts_at: new Date(`${day}T18:00:00Z`), ends_at: new Date(`${day}T19:00:00Z`), capacity: 2, est_hours: 1 })
      .returning('id');
    await t.db('shift_claims').insert({ shift_id: sh.id, user_id: holders[i % holders.length].id, via: 'board' });
  }
  return { clubId: c.id as number, siteId: site.id as number, seasonId: season.id as number, coordinator, volunteer };
}

describe('query counts', () => {
  it('are the same for a site of 5 plots and one of 60, for plots, neighbours, plot states, findings and the shift board', async () => {
    const counts: Record<string, number[]> = {};
    for (const [plots, shifts] of [
      [5, 2],
      [60, 25],
    ]) {
      const x = await clubWith(plots, shifts);
      const reads: Record<string, () => Promise<{ status: number }>> = {
        plots: () => x.coordinator.get(`/api/sites/${x.siteId}/plots`),
        neighbours: () => x.coordinator.get(`/api/sites/${x.siteId}/neighbours`),
        plotStates: () => x.coordinator.get(`/api/seasons/${x.seasonId}/plot-states?siteId=${x.siteId}`),
        findings: () => x.coordinator.get(`/api/sites/${x.siteId}/findings`),
        shiftBoard: () => x.volunteer.get(`/api/clubs/${x.clubId}/shifts`),
        shiftBoardCoordinator: () => x.coordinator.get(`/api/clubs/${x.clubId}/shifts`),
      };
      for (const [name, read] of Object.entries(reads)) (counts[name] ??= []).push(await countQueries(read));
      await truncateAll(t.db);
    }
    for (const [name, [small, large]] of Object.entries(counts)) expect({ name, large }).toEqual({ name, large: small });
    // And few: printed so a change that adds queries shows in the log.
    console.log('queries per read:', JSON.stringify(Object.fromEntries(Object.entries(counts).map(([k, v]) => [k, v[0]]))));
  });
});
