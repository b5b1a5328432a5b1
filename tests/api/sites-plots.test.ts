import { afterAll, beforeEach, describe, expect, it } from 'vitest';
import { buildClub, buildMember } from '../factories';
import { browserLikeAgent, setupTestApp, truncateAll } from '../helpers/app';

const t = setupTestApp();
afterAll(() => t.close());
beforeEach(() => truncateAll(t.db));

const siteBody = {
  name: 'North field',
  latitude: 51.5,
  longitude: -0.12,
  timeZone: 'Europe/London',
  width: 40,
  length: 30,
  pathWidth: 0.9,
};

async function coordinatorWithSite() {
  const club = await buildClub(t.db);
  const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
  const c = await browserLikeAgent(t.app);
  await c.signIn(coord.email, coord.password!);
  const site = (await c.post(`/api/clubs/${club.id}/sites`, siteBody).expect(201)).body;
  return { club, coord, c, site };
}

describe('sites', () => {
  it('creates a site with defaults, lists it and refuses bad fields with the field named', async () => {
    const { club, c, site } = await coordinatorWithSite();
    expect(site).toMatchObject({ name: 'North field', units: 'metric', grid: 0.5, pathWidth: 0.9, plotCount: 0, version: 1 });
    const list = await c.get(`/api/clubs/${club.id}/sites`).expect(200);
    expect(list.body).toMatchObject({ page: 1, total: 1 });
    expect(list.body.items[0].id).toBe(site.id);

    const bad = await c.post(`/api/clubs/${club.id}/sites`, { ...siteBody, name: 'B', latitude: 120, timeZone: 'Mars/Olympus' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toEqual({
      latitude: 'Between -90 and 90',
      timeZone: 'Unknown time zone (use a name like Europe/London)',
    });
    const dup = await c.post(`/api/clubs/${club.id}/sites`, siteBody);
    expect(dup.status).toBe(409);
  });

  it('refuses to shrink a site through its plots, and a stale version with 409', async () => {
    const { c, site } = await coordinatorWithSite();
    await c.post(`/api/sites/${site.id}/plots`, { label: 'A-1', x: 30, y: 0, width: 3, length: 6 }).expect(201);
    const cut = await c.patch(`/api/sites/${site.id}`, { version: 1, width: 20 });
    expect(cut.status).toBe(400);
    expect(cut.body.error.fields.width).toMatch(/33 m east/);
    const ok = await c.patch(`/api/sites/${site.id}`, { version: 1, pathWidth: 1.2 }).expect(200);
    expect(ok.body).toMatchObject({ pathWidth: 1.2, version: 2 });
    const stale = await c.patch(`/api/sites/${site.id}`, { version: 1, pathWidth: 0.5 });
    expect(stale.status).toBe(409);
  });
});

describe('plots', () => {
  it('creates, moves, resizes and deletes a plot, keeping a history of each step', async () => {
    const { c, site } = await coordinatorWithSite();
    const created = await c.post(`/api/sites/${site.id}/plots`, { label: 'B-12', x: 1, y: 2, width: 3, length: 6 });
    expect(created.status).toBe(201);
    expect(created.body).toMatchObject({ label: 'B-12', x: 1, y: 2, width: 3, length: 6, area: 18, rotation: 0, kind: 'in_ground', version: 1 });
    const id = created.body.id;

    const moved = await c.patch(`/api/plots/${id}`, { version: 1, x: 4.5, y: 2.5 }).expect(200);
    expect(moved.body).toMatchObject({ x: 4.5, y: 2.5, version: 2 });
    const resized = await c.patch(`/api/plots/${id}`, { version: 2, width: 2.4, rotation: 90 }).expect(200);
    expect(resized.body).toMatchObject({ width: 2.4, rotation: 90, area: 14.4, version: 3 });
    const relabelled = await c.patch(`/api/plots/${id}`, { version: 3, label: 'B-13', kind: 'raised_bed' }).expect(200);
    expect(relabelled.body.label).toBe('B-13');

    const row = await t.db('plots').where({ id }).first();
    expect(row).toMatchObject({ x_m: 4.5, y_m: 2.5, width_m: 2.4, rotation: 90, label: 'B-13', kind: 'raised_bed' });

    const detail = await c.get(`/api/plots/${id}`).expect(200);
    expect(detail.body.history.map((e: { kind: string }) => e.kind)).toEqual(['edited', 'resized', 'moved', 'created']);
    expect(detail.body.history[2].summary).toBe('Moved: x 1 m → 4.5 m, y 2 m → 2.5 m');
    expect(detail.body.holder).toBeNull();

    await c.delete(`/api/plots/${id}?version=4`).expect(204);
    expect((await c.get(`/api/plots/${id}`)).status).toBe(404);
    expect((await c.get(`/api/sites/${site.id}/plots`)).body.total).toBe(0);
    expect(await t.db('plot_events').where({ plot_id: id, kind: 'deleted' }).count()).toEqual([{ count: 1 }]);
    // The label is free again for a new plot.
    await c.post(`/api/sites/${site.id}/plots`, { label: 'B-13', x: 1, y: 2, width: 3, length: 6 }).expect(201);
  });

  it('refuses an overlapping plot with a clear message but lets plots touch', async () => {
    const { c, site } = await coordinatorWithSite();
    await c.post(`/api/sites/${site.id}/plots`, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 }).expect(201);
    const touching = await c.post(`/api/sites/${site.id}/plots`, { label: 'A-2', x: 3, y: 0, width: 3, length: 6 });
    expect(touching.status).toBe(201);
    const over = await c.post(`/api/sites/${site.id}/plots`, { label: 'A-3', x: 5, y: 5, width: 3, length: 6 });
    expect(over.status).toBe(409);
    expect(over.body.error.message).toBe('That would overlap plot A-2. Plots may touch but not overlap.');
    // Moving onto another plot is refused the same way and changes nothing.
    const a1 = (await c.get(`/api/sites/${site.id}/plots`)).body.items.find((p: { label: string }) => p.label === 'A-1');
    const moveOver = await c.patch(`/api/plots/${a1.id}`, { version: 1, x: 1 });
    expect(moveOver.status).toBe(409);
    expect((await t.db('plots').where({ id: a1.id }).first()).x_m).toBe(0);
    const outside = await c.post(`/api/sites/${site.id}/plots`, { label: 'Z-1', x: 38, y: 0, width: 3, length: 6 });
    expect(outside.status).toBe(400);
    expect(outside.body.error.fields.x).toMatch(/east edge/);
    const badBody = await c.post(`/api/sites/${site.id}/plots`, { label: '', x: -1, y: 0, width: 0, length: 6, rotation: 45 });
    expect(badBody.status).toBe(400);
    expect(Object.keys(badBody.body.error.fields).sort()).toEqual(['label', 'rotation', 'width', 'x']);
  });

  it('gives one of two parallel edits of the same version a 409, and saves only the winner', async () => {
    const { c, site } = await coordinatorWithSite();
    const id = (await c.post(`/api/sites/${site.id}/plots`, { label: 'C-4', x: 0, y: 0, width: 3, length: 6 })).body.id;
    const [r1, r2] = await Promise.all([
      c.patch(`/api/plots/${id}`, { version: 1, x: 10 }),
      c.patch(`/api/plots/${id}`, { version: 1, x: 20 }),
    ]);
    const statuses = [r1.status, r2.status].sort();
    expect(statuses).toEqual([200, 409]);
    const winner = r1.status === 200 ? r1 : r2;
    const loser = r1.status === 200 ? r2 : r1;
    expect(loser.body.error.message).toMatch(/changed by someone else/);
    expect((await t.db('plots').where({ id }).first()).x_m).toBe(winner.body.x);
    expect(await t.db('plot_events').where({ plot_id: id, kind: 'moved' }).count()).toEqual([{ count: 1 }]);
  });

  it('lets no two parallel new plots overlap each other', async () => {
    const { c, site } = await coordinatorWithSite();
    const results = await Promise.all(
      ['P-1', 'P-2', 'P-3'].map((label, i) => c.post(`/api/sites/${site.id}/plots`, { label, x: i, y: 0, width: 3, length: 3 })),
    );
    expect(results.map((r) => r.status).sort()).toEqual([201, 409, 409]);
    expect((await c.get(`/api/sites/${site.id}/plots`)).body.total).toBe(1);
  });

  it('computes neighbours from geometry: touching, across the path, not across a wider gap', async () => {
    const { c, site } = await coordinatorWithSite();
    const mk = async (label: string, x: number, y: number) =>
      (await c.post(`/api/sites/${site.id}/plots`, { label, x, y, width: 3, length: 6 }).expect(201)).body.id;
    const a = await mk('A', 0, 0);
    const b = await mk('B', 3, 0); // touches A on A's east side
    const cc = await mk('C', 0, 6.9); // south of A across a 0.9 m path
    await mk('D', 10, 0); // 4 m east of B: too far
    const res = await c.get(`/api/sites/${site.id}/neighbours`).expect(200);
    const pairs = res.body.items.map((n: { a: number; b: number; kind: string; side: string; gap: number }) => [n.a, n.b, n.kind, n.side, n.gap]);
    expect(pairs).toEqual(
      expect.arrayContaining([
        [a, b, 'touching', 'east', 0],
        [a, cc, 'across_path', 'south', 0.9],
      ]),
    );
    expect(pairs).toHaveLength(2);
    const detail = await c.get(`/api/plots/${cc}`).expect(200);
    expect(detail.body.neighbours).toEqual([{ plotId: a, label: 'A', kind: 'across_path', side: 'north', gap: 0.9 }]);
  });
});

describe('neighbours on a site measured in feet', () => {
  it('keeps plots 3 ft apart as neighbours across a 3 ft path despite millimetre storage', async () => {
    const { club } = await coordinatorWithSite();
    const c = await browserLikeAgent(t.app);
    const coord = await buildMember(t.db, { clubId: club.id, roles: ['coordinator'] });
    await c.signIn(coord.email, coord.password!);
    // 1 ft = 0.3048 m exactly (NIST SP 811); stored to the millimetre these become 0.914, 3.962 and 4.877 m.
    const ft = (v: number) => v * 0.3048;
    const site = (await c.post(`/api/clubs/${club.id}/sites`, { ...siteBody, name: 'Feet field', units: 'us', pathWidth: ft(3) }).expect(201)).body;
    const a = (await c.post(`/api/sites/${site.id}/plots`, { label: 'N-1', x: ft(3), y: 0, width: ft(10), length: ft(20) }).expect(201)).body;
    const b = (await c.post(`/api/sites/${site.id}/plots`, { label: 'N-2', x: ft(16), y: 0, width: ft(10), length: ft(20) }).expect(201)).body;
    const res = await c.get(`/api/sites/${site.id}/neighbours`).expect(200);
    expect(res.body.items).toHaveLength(1);
    expect(res.body.items[0]).toMatchObject({ a: a.id, b: b.id, kind: 'across_path', side: 'east' });
    expect(res.body.items[0].gap).toBeCloseTo(0.915, 6);
  });
});

describe('who may do what', () => {
  it('lets plot holders read the map but not change it; other clubs get 404', async () => {
    const { club, site, c } = await coordinatorWithSite();
    const id = (await c.post(`/api/sites/${site.id}/plots`, { label: 'A-1', x: 0, y: 0, width: 3, length: 6 })).body.id;
    const holder = await buildMember(t.db, { clubId: club.id, roles: ['plot_holder'] });
    const h = await browserLikeAgent(t.app);
    await h.signIn(holder.email, holder.password!);
    expect((await h.get(`/api/sites/${site.id}/plots`)).status).toBe(200);
    expect((await h.get(`/api/plots/${id}`)).status).toBe(200);
    expect((await h.patch(`/api/plots/${id}`, { version: 1, x: 5 })).status).toBe(403);
    expect((await h.post(`/api/sites/${site.id}/plots`, { label: 'H', x: 20, y: 20, width: 1, length: 1 })).status).toBe(403);
    expect((await h.post(`/api/clubs/${club.id}/sites`, { ...siteBody, name: 'Mine' })).status).toBe(403);

    const other = await buildMember(t.db, { roles: ['coordinator'] });
    const o = await browserLikeAgent(t.app);
    await o.signIn(other.email, other.password!);
    for (const res of [
      await o.get(`/api/sites/${site.id}`),
      await o.get(`/api/plots/${id}`),
      await o.patch(`/api/plots/${id}`, { version: 1, x: 5 }),
      await o.delete(`/api/plots/${id}?version=1`),
    ]) {
      expect(res.status).toBe(404);
    }
    expect((await o.get(`/api/clubs/${club.id}/sites`)).status).toBe(403);
    expect((await t.db('plots').where({ id }).first()).x_m).toBe(0);
    const anon = await browserLikeAgent(t.app);
    expect((await anon.get(`/api/sites/${site.id}/plots`)).status).toBe(401);
  });
});
