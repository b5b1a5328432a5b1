import { afterAll, describe, expect, it } from 'vitest';
import { findOverlaps, footprint } from '@shared/geometry';
import { createDb } from '../../server/db/knex';
import { testConfig, truncateAll } from '../helpers/app';

const db = createDb(testConfig().databaseUrl);
afterAll(() => db.destroy());

describe('demo seed', () => {
  it('loads two sites with about 40 valid plots (inside the site, none overlapping), the same every run', async () => {
    const snapshot = async () => {
      await truncateAll(db);
      await db.seed.run();
      return db('plots as p').join('sites as s', 's.id', 'p.site_id').orderBy(['s.name', 'p.label']).select('s.name', 'p.label', 'p.x_m', 'p.y_m');
    };
    const first = await snapshot();
    const second = await snapshot();
    expect(second).toEqual(first);

    const sites = await db('sites').orderBy('name');
    expect(sites.map((s) => [s.name, s.units])).toEqual([
      ['Mossgate Lane', 'metric'],
      ['Orchard Corner', 'us'],
    ]);
    const plots = await db('plots');
    expect(plots.length).toBeGreaterThanOrEqual(38);
    expect(new Set(plots.map((p) => p.kind))).toEqual(new Set(['in_ground', 'raised_bed', 'container', 'shared_bed']));
    for (const site of sites) {
      const rects = plots
        .filter((p) => p.site_id === site.id)
        .map((p) => ({ id: p.id, x: p.x_m, y: p.y_m, width: p.width_m, length: p.length_m, rotation: p.rotation }));
      expect(findOverlaps(rects)).toEqual([]);
      for (const r of rects) {
        const f = footprint(r);
        expect(f.maxX).toBeLessThanOrEqual(site.width_m + 1e-6);
        expect(f.maxY).toBeLessThanOrEqual(site.length_m + 1e-6);
      }
    }
    const [{ count }] = await db('users').count({ count: '*' });
    expect(count).toBe(9);
  });

  it('gives the demo holders three past seasons and this one of plantings, harvests and observations, clubroot on B-2', async () => {
    await truncateAll(db);
    await db.seed.run();
    const rows = await db('plantings as pl')
      .join('seasons as se', 'se.id', 'pl.season_id')
      .join('plots as p', 'p.id', 'pl.plot_id')
      .join('crops as c', 'c.id', 'pl.crop_id')
      .select('se.year', 'p.label', 'p.width_m', 'p.length_m', 'c.slug', 'c.club_id', 'pl.part_x_m', 'pl.part_y_m', 'pl.part_width_m', 'pl.part_length_m');
    expect([...new Set(rows.map((r) => r.year))].sort()).toEqual([2023, 2024, 2025, 2026]);
    // Every demo holder's plot has a history, on reference crops, each part inside its plot.
    expect(new Set(rows.map((r) => r.label))).toEqual(new Set(['A-1', 'A-2', 'B-1', 'B-2', 'R-1']));
    for (const r of rows) {
      expect(r.club_id).toBeNull();
      if (r.part_x_m === null) continue;
      expect(r.part_x_m + r.part_width_m, `${r.label} ${r.year} ${r.slug}`).toBeLessThanOrEqual(r.width_m + 1e-9);
      expect(r.part_y_m + r.part_length_m, `${r.label} ${r.year} ${r.slug}`).toBeLessThanOrEqual(r.length_m + 1e-9);
    }
    // Each past season's plantings sit on a plot the same person held that season.
    const unheld = await db('plantings as pl')
      .whereNotExists(db('allocations as a').whereRaw('a.plot_id = pl.plot_id and a.season_id = pl.season_id'))
      .count({ n: '*' });
    expect(Number(unheld[0].n)).toBe(0);
    expect(Number((await db('harvests').count({ n: '*' }))[0].n)).toBeGreaterThan(20);
    const clubroot = await db('observations as o').join('plots as p', 'p.id', 'o.plot_id').where('o.pest_slug', 'clubroot').select('p.label', 'o.is_soil_borne', 'o.observed_on');
    expect(clubroot).toEqual([{ label: 'B-2', is_soil_borne: true, observed_on: '2024-07-13' }]);
  });
});
