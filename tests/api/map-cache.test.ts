import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub } from '../factories';
import { addSite, signedInMember } from '../helpers/api';
import { setupTestApp, truncateAll } from '../helpers/app';

// The map's reads (plots, neighbours) are kept per server under the site's map stamp, which the
// database moves on every plot write and path-width change. Writes made behind this server's back
// (straight into the database, as another server would) must show on the next read.
const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

async function siteWithTwoPlots() {
  const club = await buildClub(t.db);
  const c = await signedInMember(t, club.id, ['coordinator']);
  const site = await addSite(c, club.id, 'Stamp field', { pathWidth: 1 });
  // Two 3 × 6 m plots side by side with a 1 m path: neighbours across a path of 1 m.
  for (const [label, x] of [['A-1', 0], ['A-2', 4]] as const) {
    await c.post(`/api/sites/${site.id}/plots`, { label, x, y: 0, width: 3, length: 6 }).expect(201);
  }
  const stamp = async () => Number((await t.db('sites').where({ id: site.id }).first('map_stamp')).map_stamp);
  return { club, c, site, stamp };
}

describe('cached map reads', () => {
  it('answer a revalidation with 304 and show a plot changed by another server on the next read', async () => {
    const { c, site } = await siteWithTwoPlots();
    const first = await c.get(`/api/sites/${site.id}/plots`).expect(200);
    expect(first.body.items.map((p: { label: string }) => p.label)).toEqual(['A-1', 'A-2']);
    const etag = first.headers.etag;
    expect(etag).toMatch(/^"[\w-]+"$/);
    await c.agent.get(`/api/sites/${site.id}/plots`).set('If-None-Match', etag).expect(304);

    // Another server renames a plot: the stamp moves, the cached answer is not used.
    await t.db('plots').where({ site_id: site.id, label: 'A-2' }).update({ label: 'A-2b' });
    const second = await c.get(`/api/sites/${site.id}/plots`).expect(200);
    expect(second.body.items.map((p: { label: string }) => p.label)).toEqual(['A-1', 'A-2b']);
    expect(second.headers.etag).not.toBe(etag);
    await c.agent.get(`/api/sites/${site.id}/plots`).set('If-None-Match', etag).expect(200);

    // A removed plot goes too (the map hides plots with deleted_at).
    await t.db('plots').where({ site_id: site.id, label: 'A-1' }).update({ deleted_at: new Date() });
    const third = await c.get(`/api/sites/${site.id}/plots`).expect(200);
    expect(third.body.items.map((p: { label: string }) => p.label)).toEqual(['A-2b']);
  });

  it('re-reads neighbours when the path width changes or a plot moves', async () => {
    const { c, site } = await siteWithTwoPlots();
    const first = await c.get(`/api/sites/${site.id}/neighbours`).expect(200);
    expect(first.body.items).toHaveLength(1); // computed: A-1 ends at x = 3, A-2 starts at 4: a 1 m gap
    expect(first.body.pathWidth).toBe(1);

    const { version } = (await c.get(`/api/sites/${site.id}`).expect(200)).body;
    await c.patch(`/api/sites/${site.id}`, { version, pathWidth: 0.5 }).expect(200);
    const narrower = await c.get(`/api/sites/${site.id}/neighbours`).expect(200);
    expect(narrower.body.pathWidth).toBe(0.5);

    // Moved 10 m east by another server: no longer neighbours.
    await t.db('plots').where({ site_id: site.id, label: 'A-2' }).update({ x_m: 14 });
    const apart = await c.get(`/api/sites/${site.id}/neighbours`).expect(200);
    expect(apart.body.items).toHaveLength(0);
  });

  it('moves the stamp with each plot write, not with a site change that leaves the map alone, and never back to an old value', async () => {
    const { site, stamp, c } = await siteWithTwoPlots();
    const before = await stamp();
    await t.db('plots').insert(Array.from({ length: 20 }, (_, i) => ({ site_id: site.id, label: `B-${i + 1}`, x_m: i * 1.5, y_m: 20, width_m: 1, length_m: 1 })));
    const afterInsert = await stamp();
    expect(afterInsert).toBeGreaterThan(before);
    const { version } = (await c.get(`/api/sites/${site.id}`).expect(200)).body;
    await c.patch(`/api/sites/${site.id}`, { version, name: 'Renamed field' }).expect(200);
    expect(await stamp()).toBe(afterInsert);
    await t.db('plots').where({ site_id: site.id }).whereLike('label', 'B-%').del();
    expect(await stamp()).toBeGreaterThan(afterInsert);
  });

  it('does not serve a cached map after the database is emptied and a site with the same id is drawn again', async () => {
    const first = await siteWithTwoPlots();
    await first.c.get(`/api/sites/${first.site.id}/plots`).expect(200);
    await truncateAll(t.db); // ids start again at 1, as after a reset
    const again = await siteWithTwoPlots();
    expect(again.site.id).toBe(first.site.id);
    await t.db('plots').where({ site_id: again.site.id, label: 'A-1' }).update({ label: 'Z-1' });
    const res = await again.c.get(`/api/sites/${again.site.id}/plots`).expect(200);
    expect(res.body.items.map((p: { label: string }) => p.label)).toEqual(['A-2', 'Z-1']);
  });

  it('never serves one site\'s cached map for another site', async () => {
    const { club, c, site } = await siteWithTwoPlots();
    const other = await addSite(c, club.id, 'Second field');
    await c.get(`/api/sites/${site.id}/plots`).expect(200);
    const empty = await c.get(`/api/sites/${other.id}/plots`).expect(200);
    expect(empty.body).toEqual({ items: [], page: 1, total: 0 });
  });
});
