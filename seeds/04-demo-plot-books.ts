import type { Knex } from 'knex';
import { pestBySlug } from '../shared/crops/pests';
import { recheckEverything } from '../server/services/findings';

// Three past seasons (2023–2025) and the 2026 season of plantings on the demo holders' plots at
// Mossgate Lane, with harvests and a few pest and disease observations (clubroot on B-2 in 2024),
// so the plot books and the rotation check have history. All of it is invented for the demo; the
// crops and pests are the reference catalogue's (shared/crops), loaded before the seeds run.

type Status = 'planned' | 'sown' | 'up' | 'harvesting' | 'finished' | 'failed';
interface DemoPlanting {
  crop: string;
  variety?: string;
  /** Part of the plot in plot metres (x, y, width, length); the whole plot when left out. */
  part?: [number, number, number, number];
  method: 'sown' | 'transplanted';
  on: string;
  rows?: number;
  quantity?: number;
  status?: Status;
  /** Harvests: date and grams, or date and a count. */
  harvests?: Array<[string, number] | [string, null, number]>;
  notes?: string;
}
interface DemoObservation {
  pest: string;
  severity: 'light' | 'moderate' | 'severe';
  on: string;
  /** Index of the planting of that plot and year it was seen on. */
  planting?: number;
  part?: [number, number, number, number];
  notes: string;
}

// A-1..B-2 are 3 × 6 m, R-1 a 2.4 × 1.2 m raised bed (seeds/02-demo-sites.ts).
const history: Record<string, { holder: string; since: number; years: Record<number, { plantings: DemoPlanting[]; observations?: DemoObservation[] }> }> = {
  'A-1': {
    holder: 'teodor@example.org',
    since: 2023,
    years: {
      2023: {
        plantings: [
          { crop: 'potato', variety: 'Charlotte', part: [0, 0, 3, 3], method: 'sown', on: '2023-04-08', rows: 3, harvests: [['2023-07-22', 9800]] },
          { crop: 'pea', variety: 'Hurst Green Shaft', part: [0, 3, 3, 3], method: 'sown', on: '2023-04-15', rows: 2, harvests: [['2023-07-01', 2100], ['2023-07-12', 1600]] },
        ],
      },
      2024: {
        plantings: [
          { crop: 'bush-bean', variety: 'Purple Teepee', part: [0, 0, 3, 3], method: 'sown', on: '2024-05-18', rows: 3, harvests: [['2024-07-28', 2600]] },
          { crop: 'carrot', variety: 'Autumn King', part: [0, 3, 3, 3], method: 'sown', on: '2024-04-20', rows: 4, harvests: [['2024-09-14', 7400]] },
        ],
        observations: [{ pest: 'carrot-fly', severity: 'light', on: '2024-08-30', planting: 1, notes: 'A few tunnelled roots at the west end.' }],
      },
      2025: {
        plantings: [
          { crop: 'cabbage', variety: 'Greyhound', part: [0, 0, 3, 3], method: 'transplanted', on: '2025-04-26', quantity: 12, harvests: [['2025-07-19', null, 10]] },
          { crop: 'onion', variety: 'Sturon', part: [0, 3, 3, 3], method: 'sown', on: '2025-03-29', rows: 4, notes: 'From sets.', harvests: [['2025-08-09', 6200]] },
        ],
        observations: [{ pest: 'cabbage-caterpillars', severity: 'moderate', on: '2025-06-21', planting: 0, notes: 'Picked off by hand; netting since.' }],
      },
      2026: {
        plantings: [
          { crop: 'tomato', variety: 'Gardener’s Delight', part: [0, 0, 3, 3], method: 'transplanted', on: '2026-05-23', quantity: 6, harvests: [['2026-08-15', 3400], ['2026-09-05', 4100]] },
          { crop: 'radish', variety: 'French Breakfast', part: [0, 3, 1, 3], method: 'sown', on: '2026-04-11', rows: 2, harvests: [['2026-05-16', null, 60]] },
          { crop: 'leek', variety: 'Musselburgh', part: [1, 3, 2, 3], method: 'transplanted', on: '2026-06-13', quantity: 40, status: 'harvesting', harvests: [['2026-11-21', 2800]] },
        ],
        observations: [{ pest: 'late-blight', severity: 'moderate', on: '2026-08-29', planting: 0, notes: 'Brown patches on the lower leaves after a wet week; affected leaves removed.' }],
      },
    },
  },
  'A-2': {
    holder: 'priya@example.org',
    since: 2023,
    years: {
      2023: { plantings: [{ crop: 'zucchini', variety: 'Defender', method: 'transplanted', on: '2023-05-27', quantity: 3, harvests: [['2023-07-15', 5200], ['2023-08-12', 6900]] }] },
      2024: {
        plantings: [
          { crop: 'onion', variety: 'Red Baron', part: [0, 0, 3, 2], method: 'sown', on: '2024-03-30', rows: 3, harvests: [['2024-08-03', 4300]] },
          { crop: 'beet', variety: 'Boltardy', part: [0, 2, 3, 4], method: 'sown', on: '2024-04-27', rows: 4, harvests: [['2024-07-20', 5600]] },
        ],
      },
      2025: { plantings: [{ crop: 'potato', variety: 'Maris Piper', method: 'sown', on: '2025-04-05', rows: 4, harvests: [['2025-09-06', 21400]] }] },
      2026: {
        plantings: [
          { crop: 'tomato', variety: 'Shirley', part: [0, 0, 3, 3], method: 'transplanted', on: '2026-05-30', quantity: 6, harvests: [['2026-08-22', 5200]] },
          { crop: 'basil', variety: 'Genovese', part: [0, 3, 1, 1], method: 'transplanted', on: '2026-06-06', quantity: 6, harvests: [['2026-07-25', 300]] },
          { crop: 'french-marigold', part: [1, 3, 2, 1], method: 'transplanted', on: '2026-05-30', quantity: 8 },
        ],
        observations: [{ pest: 'aphids', severity: 'light', on: '2026-07-04', planting: 0, notes: 'Greenfly on the growing tips; ladybirds about.' }],
      },
    },
  },
  'B-1': {
    holder: 'jonah@example.org',
    since: 2024,
    years: {
      2024: { plantings: [{ crop: 'sweet-corn', variety: 'Swift', method: 'transplanted', on: '2024-05-25', quantity: 24, harvests: [['2024-08-24', null, 30]] }] },
      2025: {
        plantings: [
          { crop: 'pea', variety: 'Kelvedon Wonder', part: [0, 0, 3, 2], method: 'sown', on: '2025-04-12', rows: 2, harvests: [['2025-07-05', 1900]] },
          { crop: 'winter-squash', variety: 'Crown Prince', part: [0, 2, 3, 4], method: 'transplanted', on: '2025-05-31', quantity: 2, harvests: [['2025-10-04', null, 5]] },
        ],
      },
      2026: {
        plantings: [
          { crop: 'lettuce', variety: 'Little Gem', part: [0, 0, 3, 2], method: 'sown', on: '2026-04-18', rows: 3, harvests: [['2026-06-13', null, 18]] },
          { crop: 'sweet-corn', variety: 'Swift', part: [0, 2, 3, 4], method: 'transplanted', on: '2026-05-23', quantity: 16, status: 'failed', notes: 'Lost to a late frost and then badgers.' },
        ],
        observations: [{ pest: 'slugs', severity: 'severe', on: '2026-05-02', planting: 0, notes: 'Half the first sowing eaten overnight.' }],
      },
    },
  },
  'B-2': {
    holder: 'aiko@example.org',
    since: 2023,
    years: {
      2023: { plantings: [{ crop: 'broccoli', variety: 'Calabrese', method: 'transplanted', on: '2023-05-06', quantity: 10, harvests: [['2023-07-29', 3900]] }] },
      2024: {
        plantings: [{ crop: 'cabbage', variety: 'January King', method: 'transplanted', on: '2024-06-01', quantity: 12, status: 'failed', notes: 'Plants wilted on warm afternoons and stopped growing.' }],
        observations: [
          { pest: 'clubroot', severity: 'severe', on: '2024-07-13', planting: 0, notes: 'Swollen, distorted roots on every plant lifted. All roots bagged and binned, not composted.' },
        ],
      },
      2025: { plantings: [{ crop: 'bush-bean', variety: 'Cobra', method: 'sown', on: '2025-05-24', rows: 4, harvests: [['2025-08-02', 3100]] }] },
      2026: {
        plantings: [
          { crop: 'potato', variety: 'Pink Fir Apple', part: [0, 0, 3, 4], method: 'sown', on: '2026-04-04', rows: 3, harvests: [['2026-09-12', 14200]] },
          { crop: 'chard', variety: 'Bright Lights', part: [0, 4, 3, 2], method: 'sown', on: '2026-04-25', rows: 2, status: 'harvesting', harvests: [['2026-07-11', 1800], ['2026-10-03', 2200]] },
        ],
      },
    },
  },
  'R-1': {
    holder: 'samir@example.org',
    since: 2025,
    years: {
      2025: { plantings: [{ crop: 'lettuce', variety: 'Salad Bowl', method: 'sown', on: '2025-04-19', rows: 3, harvests: [['2025-06-07', 1500]] }] },
      2026: {
        plantings: [
          { crop: 'radish', variety: 'Cherry Belle', part: [0, 0, 1.2, 1.2], method: 'sown', on: '2026-04-04', rows: 3, harvests: [['2026-05-09', null, 45]] },
          { crop: 'spinach', variety: 'Giant Winter', part: [1.2, 0, 1.2, 1.2], method: 'sown', on: '2026-09-05', rows: 3, status: 'up' },
        ],
      },
    },
  },
};

export async function seed(knex: Knex): Promise<void> {
  const club = await knex('clubs').where({ slug: 'mossgate' }).first('id');
  const coordinator = await knex('users').where({ email: 'maren@example.org' }).first('id');
  const site = await knex('sites').where({ club_id: club.id, name: 'Mossgate Lane' }).first('id');
  const crops = new Map<string, number>((await knex('crops').whereNull('club_id').select('slug', 'id')).map((c) => [c.slug, c.id]));
  if (crops.size === 0) throw new Error('The reference crops are not loaded: run loadReferenceCrops before the demo seeds.');
  const cropId = (slug: string) => {
    const id = crops.get(slug);
    if (!id) throw new Error(`Demo plot books name a crop not in the catalogue: ${slug}`);
    return id;
  };
  const pest = (slug: string) => {
    const found = pestBySlug(slug);
    if (!found) throw new Error(`Demo plot books name a pest not in the catalogue: ${slug}`);
    return found;
  };

  // Seasons before 2026 (seed 03 made 2026 and cleared every season before it).
  const seasonIds = new Map<number, number>();
  for (const year of [2023, 2024, 2025]) {
    const [row] = await knex('seasons')
      .insert({ club_id: club.id, year, opened_by_user_id: coordinator.id, created_at: new Date(`${year}-02-01T09:00:00Z`) })
      .returning('id');
    seasonIds.set(year, row.id);
  }
  seasonIds.set(2026, (await knex('seasons').where({ club_id: club.id, year: 2026 }).first('id')).id);

  for (const [label, h] of Object.entries(history)) {
    const plot = await knex('plots').where({ site_id: site.id, label }).first('id');
    const user = await knex('users').where({ email: h.holder }).first('id');
    for (const [yearText, season] of Object.entries(h.years)) {
      const year = Number(yearText);
      const seasonId = seasonIds.get(year)!;
      if (year < 2026) {
        await knex('allocations').insert({ season_id: seasonId, plot_id: plot.id, user_id: user.id, source: year === h.since ? 'offer' : 'renewal', created_at: new Date(`${year}-03-01T09:00:00Z`) });
      }
      const plantingIds: number[] = [];
      for (const p of season.plantings) {
        const [row] = await knex('plantings')
          .insert({
            plot_id: plot.id,
            season_id: seasonId,
            crop_id: cropId(p.crop),
            variety: p.variety ?? '',
            part_x_m: p.part?.[0] ?? null,
            part_y_m: p.part?.[1] ?? null,
            part_width_m: p.part?.[2] ?? null,
            part_length_m: p.part?.[3] ?? null,
            method: p.method,
            planted_on: p.on,
            layout: 'rows',
            row_count: p.rows ?? null,
            quantity: p.quantity ?? null,
            status: p.status ?? 'finished',
            notes: p.notes ?? '',
            created_by_user_id: user.id,
            created_at: new Date(`${p.on}T18:00:00Z`),
          })
          .returning('id');
        plantingIds.push(row.id);
        for (const [on, grams, count] of p.harvests ?? []) {
          await knex('harvests').insert({ planting_id: row.id, harvested_on: on, grams: grams ?? null, count: count ?? null, created_by_user_id: user.id });
        }
      }
      for (const o of season.observations ?? []) {
        const planting = o.planting === undefined ? null : season.plantings[o.planting];
        const part = o.part ?? planting?.part;
        await knex('observations').insert({
          plot_id: plot.id,
          planting_id: o.planting === undefined ? null : plantingIds[o.planting],
          pest_slug: o.pest,
          name: pest(o.pest).name,
          kind: pest(o.pest).kind,
          is_soil_borne: pest(o.pest).soilBorne,
          part_x_m: part?.[0] ?? null,
          part_y_m: part?.[1] ?? null,
          part_width_m: part?.[2] ?? null,
          part_length_m: part?.[3] ?? null,
          severity: o.severity,
          observed_on: o.on,
          notes: o.notes,
          created_by_user_id: user.id,
        });
      }
    }
  }
  // The neighbour check's findings for the demo plantings, as the product keeps them after each change.
  await recheckEverything(knex);
}
