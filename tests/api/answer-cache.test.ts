import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { addSite, signedInMember } from '../helpers/api';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

// Whole answers of the map and board reads are reused per person while the database's transaction
// snapshot (read with the session) is unchanged (server/cache/answer-cache.ts). Writes made behind
// this server's back, straight into the database as another server would, must show on the next read;
// a reused answer must never reach another person or outlive a role.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

async function queriesDuring(fn: () => Promise<unknown>) {
  let n = 0;
  const listener = () => n++;
  t.db.on('query', listener);
  try {
    await fn();
  } finally {
    t.db.off('query', listener);
  }
  return n;
}

async function fieldWithPlot() {
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const site = await addSite(c, club.id, 'Snapshot field');
  await c.post(`/api/sites/${site.id}/plots`, { label: 'B-1', x: 0, y: 0, width: 3, length: 6 }).expect(201);
  return { club, c, site };
}

describe('reused answers', () => {
  it('make no query of their own while nothing changed, and are built again after a write anywhere', async () => {
    const { club, c, site } = await fieldWithPlot();
    const url = `/api/clubs/${club.id}/shifts`;
    const first = await c.get(url).expect(200);
    // The same read again: from the cache, no knex query (the session's own query brings the stamp).
    expect(await queriesDuring(() => c.get(url).expect(200))).toBe(0);

    // Another server adds a shift: the snapshot moves, the next read builds the answer again and shows it.
    await t.db('shifts').insert({
      club_id: club.id, site_id: site.id, title: 'Evening watering', kind: 'water', on_date: '2099-06-01', start_time: '18:00', end_time: '19:00',
      starts_at: new Date('2099-06-01T18:00:00Z'), ends_at: new Date('2099-06-01T19:00:00Z'), capacity: 2, est_hours: 1,
    });
    let after!: { body: { items: Array<{ title: string }> } };
    expect(await queriesDuring(async () => (after = await c.get(`${url}?from=2099-05-30&to=2099-06-05`).expect(200)))).toBeGreaterThan(0);
    expect(after.body.items.map((s) => s.title)).toEqual(['Evening watering']);
    expect(first.body.items).toEqual([]);
  });

  it('show a plot renamed by another server on the next read of the map', async () => {
    const { c, site } = await fieldWithPlot();
    const url = `/api/sites/${site.id}/plots`;
    expect((await c.get(url).expect(200)).body.items.map((p: { label: string }) => p.label)).toEqual(['B-1']);
    await c.get(url).expect(200);
    await t.db('plots').where({ site_id: site.id }).update({ label: 'B-1x' });
    expect((await c.get(url).expect(200)).body.items.map((p: { label: string }) => p.label)).toEqual(['B-1x']);
  });

  it("never give one person's answer to another: a plot holder asking a coordinator's read is still refused", async () => {
    const { club, c, site } = await fieldWithPlot();
    const url = `/api/sites/${site.id}/findings`;
    await c.get(url).expect(200);
    await c.get(url).expect(200);
    const holder = await signedInMember(t, club.id, ['plot_holder']);
    await holder.get(url).expect(403);
    // And anonymous: no session, no stamp, the route's own check.
    const anon = await browserLikeAgent(t.app);
    await anon.get(url).expect(401);
  });

  it('stop at once when the role is taken away, even between two identical reads', async () => {
    const { club, c, site } = await fieldWithPlot();
    const url = `/api/sites/${site.id}/findings`;
    await c.get(url).expect(200);
    await c.get(url).expect(200);
    await t.db('memberships').where({ club_id: club.id, user_id: c.person.id }).del();
    // No longer a member: the site is another club's record to them, which answers 404 (DEVELOPERS.md).
    await c.get(url).expect(404);
  });

  it('end with the session: after signing out the same read is refused', async () => {
    const { club, c } = await fieldWithPlot();
    const url = `/api/clubs/${club.id}/my-plot`;
    await c.get(url).expect(200);
    await c.get(url).expect(200);
    await c.delete('/api/session').expect(204);
    await c.get(url).expect(401);
  });

  it('keep the people apart: two holders reading the same address each get their own plot', async () => {
    const club = await buildClub(t.db);
    const c = await signedInMember(t, club.id, ['coordinator']);
    const site = await addSite(c, club.id, 'Two holders');
    const a = await signedInMember(t, club.id, ['plot_holder']);
    const b = await signedInMember(t, club.id, ['plot_holder']);
    const [season] = await t.db('seasons').insert({ club_id: club.id, year: new Date().getUTCFullYear() }).returning('id');
    for (const [label, who, x] of [['H-1', a, 0], ['H-2', b, 4]] as const) {
      const plot = (await c.post(`/api/sites/${site.id}/plots`, { label, x, y: 0, width: 3, length: 6 }).expect(201)).body;
      await t.db('allocations').insert({ season_id: season.id, plot_id: plot.id, user_id: who.person.id, source: 'manual' });
    }
    const url = `/api/clubs/${club.id}/my-plot`;
    const labels = (body: unknown) => JSON.stringify(body).match(/H-\d/g);
    const ra = await a.get(url).expect(200);
    await a.get(url).expect(200);
    const rb = await b.get(url).expect(200);
    expect(labels(ra.body)).toContain('H-1');
    expect(labels(ra.body)).not.toContain('H-2');
    expect(labels(rb.body)).toContain('H-2');
    expect(labels(rb.body)).not.toContain('H-1');
  });

  it('are not kept for other members of the club through a shared address (a volunteer reads the board after the coordinator)', async () => {
    const { club, c } = await fieldWithPlot();
    const v = await buildMember(t.db, { clubId: club.id, roles: ['volunteer'] });
    expect(v.id).not.toBe(c.person.id);
    const url = `/api/clubs/${club.id}/season-summary`;
    await c.get(url).expect(200);
    const volunteer = await signedInMember(t, club.id, ['volunteer']);
    await volunteer.get(url).expect(403);
  });
});
