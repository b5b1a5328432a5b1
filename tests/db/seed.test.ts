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
    // Nine people with passwords (seeds/01) and Wren, who volunteers without one (seeds/07).
    expect(count).toBe(10);
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

  it('gives both demo sites invented daily weather from 1 April 2026 to the seed’s fixed date, the same every run', async () => {
    const snapshot = async () => {
      await truncateAll(db);
      await db.seed.run();
      return db('weather_days as w').join('sites as s', 's.id', 'w.site_id').orderBy(['s.name', 'w.day']).select('s.name', 'w.*');
    };
    const strip = (rows: Array<Record<string, unknown>>) => rows.map(({ id: _i, site_id: _s, entered_by_user_id: _e, ...rest }) => rest);
    const first = await snapshot();
    expect(strip(await snapshot())).toEqual(strip(first));

    const sites = await db('sites').orderBy('name').select('name', 'elevation_m');
    expect(sites).toEqual([
      { name: 'Mossgate Lane', elevation_m: 60 },
      { name: 'Orchard Corner', elevation_m: 1650 },
    ]);
    const rows = await snapshot();
    const of = (name: string) => rows.filter((r) => r.name === name);
    const mossgate = of('Mossgate Lane');
    const orchard = of('Orchard Corner');
    // computed: 1 April to 20 November 2026 is 30 + 31 + 30 + 31 + 31 + 30 + 31 + 20 = 234 days
    expect(mossgate).toHaveLength(234);
    expect([mossgate[0].day, mossgate.at(-1).day]).toEqual(['2026-04-01', '2026-11-20']);
    expect(orchard.length).toBeLessThan(234);
    expect(orchard.length).toBeGreaterThan(200);

    // Mossgate: most days hold everything FAO-56 Penman-Monteith needs (temperatures, humidity, wind with
    // its height, sunshine); some hold only the rain gauge's reading.
    const full = mossgate.filter((r) => [r.t_min_c, r.t_max_c, r.rh_min_pct, r.rh_max_pct, r.wind_ms, r.wind_height_m, r.sunshine_h].every((v) => v !== null));
    const rainOnly = mossgate.filter((r) => r.rain_mm !== null && r.t_max_c === null && r.sunshine_h === null);
    expect(full.length).toBeGreaterThan(mossgate.length * 0.8);
    expect(rainOnly.length).toBeGreaterThan(3);
    expect(rainOnly.every((r) => r.source === 'gauge')).toBe(true);
    // Orchard Corner: temperatures and rain only (Hargreaves), never humidity, wind or sunshine.
    expect(orchard.every((r) => r.t_min_c !== null && r.t_max_c !== null && r.rain_mm !== null)).toBe(true);
    expect(orchard.every((r) => r.rh_min_pct === null && r.wind_ms === null && r.sunshine_h === null && r.solar_mj_m2 === null)).toBe(true);
    // Within the log's own rules, and summer warmer than spring at both.
    for (const r of rows) {
      if (r.t_min_c !== null) expect(r.t_min_c, `${r.name} ${r.day}`).toBeLessThanOrEqual(r.t_max_c);
      if (r.sunshine_h !== null) expect(r.sunshine_h).toBeLessThanOrEqual(24);
    }
    const meanMax = (list: typeof rows, month: string) => {
      const inMonth = list.filter((r) => r.day.startsWith(month) && r.t_max_c !== null);
      return inMonth.reduce((sum, r) => sum + r.t_max_c, 0) / inMonth.length;
    };
    expect(meanMax(mossgate, '2026-07')).toBeGreaterThan(meanMax(mossgate, '2026-04'));
    expect(meanMax(orchard, '2026-07')).toBeGreaterThan(meanMax(orchard, '2026-04'));
  });

  it('gives the demo club past shifts done by its volunteers and the coming weeks’ shifts built from its open tasks', async () => {
    await truncateAll(db);
    await db.seed.run();
    const shifts = await db('shifts as sh').leftJoin('shift_tasks as st', 'st.shift_id', 'sh.id').groupBy('sh.id').orderBy('sh.starts_at').select('sh.id', 'sh.title', 'sh.starts_at', 'sh.kind', db.raw('count(st.task_id)::int as tasks'));
    const now = Date.now();
    const past = shifts.filter((s: { starts_at: Date }) => new Date(s.starts_at).getTime() < now);
    const coming = shifts.filter((s: { starts_at: Date }) => new Date(s.starts_at).getTime() > now);
    expect(past.length).toBe(5);
    expect(past.every((s: { tasks: number }) => s.tasks === 0)).toBe(true);
    // Coming: compost four Saturdays, troughs three Wednesdays, leaf mould once, grouped by day and kind (seeds/07).
    expect(coming.length).toBe(8);
    expect(coming.every((s: { tasks: number }) => s.tasks === 1)).toBe(true);
    expect(coming.some((s: { title: string }) => /^Saturday morning mulching, the shared beds$/.test(s.title))).toBe(true);
    // Hours: only done places count; Lucía did three 2026 shifts (1.5 + 2 + 2.5 h).
    const lucia = await db('shift_claims as c').join('users as u', 'u.id', 'c.user_id').where({ 'u.email': 'lucia@example.org', 'c.status': 'done' }).sum({ h: 'c.hours' }).first();
    expect(Number(lucia!.h)).toBe(6);
    const wren = await db('users').where({ email: 'wren@example.org' }).first('password_hash');
    expect(wren.password_hash).toBeNull();
  });
});
