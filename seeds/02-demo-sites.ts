import type { Knex } from 'knex';
import { feetToMetres } from '@shared/geometry';

// Two invented sites for the demo club: one laid out in metres, one in feet.
// Sizes are the usual community-garden ones: 3 × 6 m and 10 × 20 ft plots, 1.2 × 2.4 m
// (4 × 8 ft) raised beds, a few containers and a shared bed, on a grid of paths.

interface SeedPlot {
  label: string;
  x: number;
  y: number;
  width: number;
  length: number;
  kind?: 'in_ground' | 'raised_bed' | 'container' | 'shared_bed';
  rotation?: 0 | 90;
  sun?: 'full' | 'part' | 'shade';
  is_accessible?: boolean;
  has_water_tap?: boolean;
  soil_depth_m?: number;
  soil_ph?: number;
  notes?: string;
}

function metricPlots(): SeedPlot[] {
  const plots: SeedPlot[] = [];
  const step = 3 + 0.9; // plot width plus path
  for (let i = 0; i < 8; i++) {
    plots.push({ label: `A-${i + 1}`, x: 1 + i * step, y: 1, width: 3, length: 6, soil_ph: 6.5 + (i % 3) * 0.2 });
    plots.push({ label: `B-${i + 1}`, x: 1 + i * step, y: 7.9, width: 3, length: 6, soil_ph: 6.2 + (i % 4) * 0.2, has_water_tap: i === 3 });
  }
  for (let i = 0; i < 6; i++) {
    plots.push({
      label: `R-${i + 1}`,
      x: 1 + i * (2.4 + 1.5),
      y: 15.8,
      width: 2.4,
      length: 1.2,
      kind: 'raised_bed',
      soil_depth_m: 0.45,
      is_accessible: i < 2,
      notes: i < 2 ? 'Raised to 75 cm for wheelchair use.' : '',
    });
  }
  for (let i = 0; i < 3; i++) {
    plots.push({ label: `K-${i + 1}`, x: 25 + i * 1.6, y: 15.8, width: 1, length: 1, kind: 'container', soil_depth_m: 0.35, sun: 'part' });
  }
  plots.push({ label: 'Herb bed', x: 1, y: 18.5, width: 6, length: 2, kind: 'shared_bed', notes: 'Tended together on work days.' });
  return plots;
}

function usPlots(): SeedPlot[] {
  const ft = feetToMetres;
  const plots: SeedPlot[] = [];
  for (let i = 0; i < 6; i++) {
    plots.push({ label: `N-${i + 1}`, x: ft(3 + i * 13), y: ft(3), width: ft(10), length: ft(20), soil_ph: 6.8 });
    plots.push({ label: `S-${i + 1}`, x: ft(3 + i * 13), y: ft(26), width: ft(10), length: ft(20), soil_ph: 7.0, sun: i > 3 ? 'part' : 'full' });
  }
  for (let i = 0; i < 4; i++) {
    plots.push({
      label: `RB-${i + 1}`,
      x: ft(3 + i * 11),
      y: ft(50),
      width: ft(8),
      length: ft(4),
      kind: 'raised_bed',
      soil_depth_m: ft(1.5),
      is_accessible: i === 0,
    });
  }
  plots.push({ label: 'Pollinator strip', x: ft(50), y: ft(50), width: ft(24), length: ft(4), kind: 'shared_bed' });
  return plots;
}

export async function seed(knex: Knex): Promise<void> {
  await knex('sites').delete();
  const club = await knex('clubs').where({ slug: 'mossgate' }).first('id');
  const coordinator = await knex('users').where({ email: 'maren@example.org' }).first('id');
  const sites = [
    {
      row: {
        club_id: club.id,
        name: 'Mossgate Lane',
        address: '14 Mossgate Lane (invented address)',
        latitude: 53.4,
        longitude: -2.2,
        time_zone: 'Europe/London',
        units: 'metric',
        path_width_m: 0.9,
        grid_m: 0.1,
        width_m: 34,
        length_m: 22,
        last_spring_frost: '04-25',
        first_autumn_frost: '10-20',
        // Soil at about 10 cm by month, January first: invented for the demo, near what a lowland
        // site in north-west England sees (from memory), so the check can say when it is too cold to sow.
        soil_temps_c: JSON.stringify([3, 3, 5, 8, 12, 15, 17, 16, 14, 10, 6, 4]),
        // Invented for the demo: a lowland site.
        elevation_m: 60,
        soil_notes: 'Clay loam; lime added to the B row in 2025.',
      },
      plots: metricPlots(),
    },
    {
      row: {
        club_id: club.id,
        name: 'Orchard Corner',
        address: 'Behind the old orchard wall (invented)',
        latitude: 40.0,
        longitude: -105.2,
        time_zone: 'America/Denver',
        units: 'us',
        path_width_m: feetToMetres(3),
        grid_m: feetToMetres(1),
        width_m: feetToMetres(84),
        length_m: feetToMetres(60),
        last_spring_frost: '05-10',
        first_autumn_frost: '10-05',
        // Invented for the demo, near a high-plains site at 40° N (from memory), °C, January first.
        soil_temps_c: JSON.stringify([0, 2, 5, 9, 14, 20, 23, 22, 18, 11, 5, 1]),
        // Invented for the demo: a high-plains site (about 5400 ft).
        elevation_m: 1650,
        soil_notes: 'Sandy; beds topped up with compost each spring.',
      },
      plots: usPlots(),
    },
  ];
  for (const s of sites) {
    const [site] = await knex('sites').insert(s.row).returning('id');
    const rows = await knex('plots')
      .insert(
        s.plots.map((p) => ({
          site_id: site.id,
          label: p.label,
          x_m: p.x,
          y_m: p.y,
          width_m: p.width,
          length_m: p.length,
          rotation: p.rotation ?? 0,
          kind: p.kind ?? 'in_ground',
          sun: p.sun ?? 'full',
          is_accessible: p.is_accessible ?? false,
          has_water_tap: p.has_water_tap ?? false,
          soil_depth_m: p.soil_depth_m ?? null,
          soil_ph: p.soil_ph ?? null,
          notes: p.notes ?? '',
        })),
      )
      .returning(['id', 'label']);
    await knex('plot_events').insert(
      rows.map((r) => ({ plot_id: r.id, user_id: coordinator.id, kind: 'created', details: JSON.stringify({ label: r.label }) })),
    );
  }
}
