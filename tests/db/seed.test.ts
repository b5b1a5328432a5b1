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
});
